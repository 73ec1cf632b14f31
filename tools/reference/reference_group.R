# Comparisons against a reference group: Dunn's z (Dunn 1964, with the tie
# correction) of each group against the reference, its two-sided normal p,
# and p.adjust over those k-1 p-values only, with R's stats, for R's
# PlantGrowth (ctrl as the reference) and InsectSprays (spray C as the
# reference, heavy ties). Writes testdata/reference_group/expected.tsv.
# Run: Rscript tools/reference/reference_group.R testdata/reference_group
args <- commandArgs(trailingOnly = TRUE)
out <- args[1]
cases <- list(
  list(name = "plantgrowth", value = PlantGrowth$weight, group = PlantGrowth$group, reference = "ctrl"),
  list(name = "insectsprays", value = InsectSprays$count, group = InsectSprays$spray, reference = "C")
)
rows <- list()
for (c in cases) {
  r <- rank(c$value); n <- length(c$value)
  ties <- table(c$value); tie <- sum(ties^3 - ties) / (12 * (n - 1))
  others <- setdiff(levels(c$group), c$reference)
  z <- p <- numeric(0)
  for (g in others) {
    a <- r[c$group == c$reference]; b <- r[c$group == g]
    z <- c(z, (mean(a) - mean(b)) / sqrt((n * (n + 1) / 12 - tie) * (1 / length(a) + 1 / length(b))))
  }
  p <- 2 * pnorm(-abs(z))
  rows[[c$name]] <- data.frame(dataset = c$name, reference = c$reference, other = others, z = z, p = p,
    holm = p.adjust(p, "holm"), bonferroni = p.adjust(p, "bonferroni"), hochberg = p.adjust(p, "hochberg"), bh = p.adjust(p, "BH"))
}
cat("# Dunn's z of the reference against each other group, p two-sided, p.adjust over the k-1 comparisons;", R.version.string, "\n",
  file = file.path(out, "expected.tsv"))
suppressWarnings(write.table(format(do.call(rbind, rows), digits = 17), file.path(out, "expected.tsv"), sep = "\t",
  quote = FALSE, row.names = FALSE, append = TRUE))
