# Writes open datasets shipped by R's `datasets` package as long-layout CSV
# (group label, value; NA where R has a missing value) and the Kruskal–Wallis
# reference values computed by R's stats package.
# Run by generate.sh; arguments: output folder.
args <- commandArgs(trailingOnly = TRUE)
out <- args[1]
version <- paste(R.version$major, R.version$minor, sep = ".")

sets <- list(
  airquality_ozone = data.frame(group = paste0("month", airquality$Month), value = airquality$Ozone),
  plantgrowth = data.frame(group = as.character(PlantGrowth$group), value = PlantGrowth$weight),
  insectsprays = data.frame(group = as.character(InsectSprays$spray), value = InsectSprays$count),
  chickwts = data.frame(group = as.character(chickwts$feed), value = chickwts$weight),
  # yes/no (transmission manual = 1) by number of cylinders: a 2 × 3 table
  mtcars_am = data.frame(group = paste0(mtcars$cyl, "cyl"), value = mtcars$am),
  # a count on three levels (0, 1, 2 or more induced abortions) by education: a 3 × 3 table
  infert_induced = data.frame(group = as.character(infert$education), value = infert$induced),
  # Hollander & Wolfe (1973), p. 116, as reproduced in the help page of R's kruskal.test.
  hollander_wolfe = data.frame(
    group = rep(c("normal", "oad", "asbestosis"), c(5, 4, 5)),
    value = c(2.9, 3.0, 2.5, 2.6, 3.2, 3.8, 2.7, 4.0, 2.4, 2.8, 3.4, 3.7, 2.2, 2.0))
)

ref <- file.path(out, "r_stats.tsv")
cat("dataset\tquantity\tvalue\tsource\n", file = ref)
emit <- function(name, quantity, value, call) {
  cat(sprintf("%s\t%s\t%.17g\t%s\n", name, quantity, value,
              sprintf("R %s stats::%s", version, call)), file = ref, append = TRUE)
}
for (name in names(sets)) {
  d <- sets[[name]]
  d$group <- factor(d$group, levels = unique(d$group))
  write.csv(d, file.path(out, paste0(name, ".csv")), row.names = FALSE, quote = FALSE, na = "NA")
  kt <- kruskal.test(value ~ group, data = d)
  emit(name, "h", kt$statistic, "kruskal.test(value ~ group)$statistic")
  emit(name, "df", kt$parameter, "kruskal.test(value ~ group)$parameter")
  emit(name, "p", kt$p.value, "kruskal.test(value ~ group)$p.value")
  x <- d[!is.na(d$value), ]
  x$group <- droplevels(x$group)
  r <- rank(x$value)
  t <- table(x$value)
  n <- nrow(x)
  emit(name, "tie_correction", 1 - sum(t^3 - t) / (n^3 - n), "rank/table: 1 - sum(t^3-t)/(n^3-n)")
  for (g in levels(x$group)) {
    v <- x$value[x$group == g]
    q <- quantile(v, c(0.25, 0.5, 0.75), type = 7)
    emit(name, paste0("rank_sum:", g), sum(r[x$group == g]), "sum(rank(value)[group == g])")
    emit(name, paste0("q1:", g), q[[1]], "quantile(type = 7)")
    emit(name, paste0("median:", g), q[[2]], "quantile(type = 7)")
    emit(name, paste0("q3:", g), q[[3]], "quantile(type = 7)")
  }
}
