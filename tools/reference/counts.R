# Writes counts tables (one row per group, one column per ordered level, as survey tools export an
# ordinal item) and a long table with a count column into testdata/counts/, with the Kruskal-Wallis
# figures R's kruskal.test gives on the rep()-expanded values and each group's shares per level
# from prop.table. Run from the project root:  Rscript tools/reference/counts.R
out <- "testdata/counts"
# the five-level counts of two groups quoted in scipy issue 4017 (github.com/scipy/scipy/issues/4017)
scipy4017 <- rbind(first = c(163, 81, 40, 6, 2), second = c(1007, 362, 99, 27, 13))
colnames(scipy4017) <- c("1", "2", "3", "4", "5")
# R's esoph: controls by age group (rows) and alcohol consumption (ordered columns)
esoph_counts <- xtabs(ncontrols ~ agegp + alcgp, esoph)
tables <- list(
  list(file = "scipy4017_counts.csv", counts = scipy4017, write = function(f, m)
    write.csv(data.frame(group = rownames(m), unclass(m), check.names = FALSE), f, row.names = FALSE)),
  list(file = "esoph_counts.csv", counts = unclass(esoph_counts), write = function(f, m)
    write.csv(data.frame(agegp = rownames(m), m, check.names = FALSE), f, row.names = FALSE)),
  # the same as one row per age group and level, the level as its number, with a count column
  list(file = "esoph_long_count.csv", counts = unclass(esoph_counts), write = function(f, m) {
    long <- as.data.frame(as.table(m))
    write.csv(data.frame(agegp = long$agegp, alcohol = as.integer(long$alcgp), controls = long$Freq), f, row.names = FALSE)
  })
)
rows <- character()
shares <- character()
for (x in tables) {
  m <- x$counts
  x$write(file.path(out, x$file), m)
  values <- lapply(seq_len(nrow(m)), function(g) rep(seq_len(ncol(m)), m[g, ]))
  k <- kruskal.test(values)
  rows <- c(rows, paste(x$file, nrow(m), sum(m), sprintf("%.15g", k$statistic), k$parameter, sprintf("%.15g", k$p.value),
                        paste("R", getRversion(), "kruskal.test on rep()"), sep = "\t"))
  p <- prop.table(m, 1)
  for (g in seq_len(nrow(m))) {
    shares <- c(shares, paste(x$file, rownames(m)[g], paste(sprintf("%.15g", p[g, ]), collapse = ","), sep = "\t"))
  }
}
writeLines(c("file\tk\tn\th\tdf\tp\tsource", rows), file.path(out, "expected.tsv"))
writeLines(c("file\tgroup\tshares (R prop.table(m, 1), levels in column order)", shares), file.path(out, "shares.tsv"))
