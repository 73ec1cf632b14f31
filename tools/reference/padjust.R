# Adjusted p-values from R's p.adjust for a fixed set of raw p-values, for
# core/adjust's tests (Šidák by its definition 1 - (1 - p)^m, which p.adjust
# lacks); argument: output TSV path.
args <- commandArgs(trailingOnly = TRUE)
version <- paste(R.version$major, R.version$minor, sep = ".")
p <- c(0.01, 0.04, 0.03, 0.005, 0.2, 0.04, 0.9, 1e-12)
rows <- c("method\tadjusted\tsource")
for (m in c("holm", "bonferroni", "hochberg", "BH", "BY", "none")) {
  rows <- c(rows, sprintf("%s\t%s\tR %s stats::p.adjust(p, \"%s\")", tolower(m),
                          paste(sprintf("%.17g", p.adjust(p, m)), collapse = ","), version, m))
}
rows <- c(rows, sprintf("sidak\t%s\tR %s 1 - (1 - p)^length(p)", paste(sprintf("%.17g", 1 - (1 - p)^length(p)), collapse = ","), version))
writeLines(c(sprintf("# raw p-values: %s", paste(p, collapse = ",")), rows), args[1])
