# R's chickwts (datasets package) as a long table for the tests of what is
# shared (core/findings): feed, weight in grams, in R's row order.
# Run: Rscript tools/reference/protect.R testdata/protect
args <- commandArgs(trailingOnly = TRUE)
write.csv(data.frame(feed = as.character(chickwts$feed), weight = chickwts$weight),
  file.path(args[1], "chickwts.csv"), row.names = FALSE)
