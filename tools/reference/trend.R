# The Jonckheere-Terpstra statistic on R datasets with ordered groups, and
# Kendall's tau-b and z between the group order and the values with R's
# cor.test (method = "kendall", exact = FALSE, continuity = FALSE), which the
# tie-corrected Jonckheere-Terpstra z equals; J counted pair by pair here.
# Writes testdata/trend/ (each dataset as group,value CSV in the groups'
# order, and expected.tsv). Run: Rscript tools/reference/trend.R testdata/trend
args <- commandArgs(trailingOnly = TRUE)
out <- args[1]
cases <- list(
  list(name = "warpbreaks", group = warpbreaks$tension, value = warpbreaks$breaks),
  list(name = "toothgrowth", group = factor(ToothGrowth$dose), value = ToothGrowth$len),
  list(name = "esoph", group = esoph$agegp, value = esoph$ncases),
  list(name = "airquality", group = factor(airquality$Month), value = airquality$Ozone),
  # Hollander & Wolfe, Nonparametric Statistical Methods (2nd ed. 1999), the
  # worked example of section 6.2: pieces produced by workers given no, rough
  # or accurate information on their performance (from memory; the book gives
  # J = 79, which the count below must reproduce)
  list(name = "hollander_wolfe", group = factor(rep(c("none", "rough", "accurate"), each = 6),
    levels = c("none", "rough", "accurate")),
    value = c(40, 35, 38, 43, 44, 41, 38, 40, 47, 44, 40, 42, 48, 40, 45, 43, 46, 44))
)
rows <- list()
for (c in cases) {
  keep <- !is.na(c$value)
  g <- droplevels(c$group[keep]); v <- c$value[keep]
  write.csv(data.frame(group = as.character(g), value = v), file.path(out, paste0(c$name, ".csv")), row.names = FALSE)
  lv <- levels(g)
  j <- 0
  for (a in seq_along(lv)) for (b in seq_along(lv)) if (a < b) {
    x <- v[g == lv[a]]; y <- v[g == lv[b]]
    j <- j + sum(outer(x, y, "<")) + 0.5 * sum(outer(x, y, "=="))
  }
  k <- suppressWarnings(cor.test(v, as.numeric(g), method = "kendall", exact = FALSE, continuity = FALSE))
  up <- suppressWarnings(cor.test(v, as.numeric(g), method = "kendall", exact = FALSE, continuity = FALSE, alternative = "greater"))
  rows[[c$name]] <- data.frame(dataset = c$name, levels = paste(lv, collapse = "|"), j = j, z = unname(k$statistic),
    tau_b = unname(k$estimate), p_two_sided = k$p.value, p_increasing = up$p.value)
}
cat("# J pair by pair; z, tau_b and p from cor.test(method = \"kendall\", exact = FALSE, continuity = FALSE);", R.version.string, "\n",
  file = file.path(out, "expected.tsv"))
suppressWarnings(write.table(format(do.call(rbind, rows), digits = 17), file.path(out, "expected.tsv"), sep = "\t",
  quote = FALSE, row.names = FALSE, append = TRUE))
