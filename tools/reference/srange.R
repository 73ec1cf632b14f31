# Upper tail of the studentized range from R's ptukey, over a grid of q, k
# and df; argument: output TSV path.
args <- commandArgs(trailingOnly = TRUE)
version <- paste(R.version$major, R.version$minor, sep = ".")
rows <- c("q\tk\tdf\tupper\tsource")
for (df in c(5, 10, 20, 60, Inf)) for (k in c(2, 3, 4, 5, 7, 10)) for (q in c(1, 2.5, 4, 6)) {
  p <- ptukey(q, k, df, lower.tail = FALSE)
  rows <- c(rows, sprintf("%.17g\t%d\t%s\t%.17g\tR %s stats::ptukey(q, k, df, lower.tail = FALSE)", q, k, df, p, version))
}
writeLines(rows, args[1])
