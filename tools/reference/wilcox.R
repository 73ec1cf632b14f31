# Pairwise Wilcoxon-Mann-Whitney p-values from R's wilcox.test (exact where
# R chooses it: no ties and fewer than 50 per group; otherwise normal with
# continuity correction), on the CSV files written by datasets.R.
# Arguments: the folder; writes wilcox.tsv there.
args <- commandArgs(trailingOnly = TRUE)
version <- paste(R.version$major, R.version$minor, sep = ".")
rows <- c("dataset\ta\tb\tU\tp\texact\tsource")
for (name in c("insectsprays", "chickwts", "plantgrowth", "hollander_wolfe")) {
  d <- read.csv(file.path(args[1], paste0(name, ".csv")), stringsAsFactors = FALSE)
  d <- d[!is.na(d$value), ]
  labels <- unique(d$group)
  for (i in seq_along(labels)) for (j in seq_along(labels)) if (i < j) {
    x <- d$value[d$group == labels[i]]; y <- d$value[d$group == labels[j]]
    w <- suppressWarnings(wilcox.test(x, y))
    ex <- length(unique(c(x, y))) == length(c(x, y)) && length(x) < 50 && length(y) < 50
    rows <- c(rows, sprintf("%s\t%s\t%s\t%.17g\t%.17g\t%s\tR %s stats::wilcox.test(x, y)", name, labels[i], labels[j],
                            w$statistic, w$p.value, ex, version))
  }
}
writeLines(rows, file.path(args[1], "wilcox.tsv"))
