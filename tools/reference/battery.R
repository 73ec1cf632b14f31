# Kruskal-Wallis on several measures by one grouping, each measure's p then
# adjusted across the measures with p.adjust (BH and Holm), with R's stats;
# writes testdata/battery/ (the datasets as CSV and expected.tsv).
# Run: Rscript tools/reference/battery.R testdata/battery
args <- commandArgs(trailingOnly = TRUE)
out <- args[1]
write.csv(airquality, file.path(out, "airquality.csv"), row.names = FALSE, na = "")
write.csv(data.frame(car = rownames(mtcars), mtcars), file.path(out, "mtcars.csv"), row.names = FALSE)
cases <- list(
  list(name = "airquality", data = airquality, group = "Month", measures = c("Ozone", "Solar.R", "Wind", "Temp")),
  list(name = "mtcars", data = mtcars, group = "cyl", measures = c("mpg", "disp", "hp", "drat", "wt", "qsec"))
)
rows <- list()
for (c in cases) {
  h <- p <- numeric(0)
  for (m in c$measures) {
    k <- kruskal.test(c$data[[m]] ~ factor(c$data[[c$group]]))
    h <- c(h, unname(k$statistic)); p <- c(p, k$p.value)
  }
  rows[[c$name]] <- data.frame(dataset = c$name, group = c$group, measure = c$measures, h = h, p = p,
    p_bh = p.adjust(p, "BH"), p_holm = p.adjust(p, "holm"))
}
cat("# kruskal.test then p.adjust across the measures;", R.version.string, "\n", file = file.path(out, "expected.tsv"))
suppressWarnings(write.table(format(do.call(rbind, rows), digits = 17), file.path(out, "expected.tsv"), sep = "\t",
  quote = FALSE, row.names = FALSE, append = TRUE))
