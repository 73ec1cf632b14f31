# Writes R datasets as analysts' exports (testdata/reading/) and the
# Kruskal-Wallis figures R's kruskal.test gives for the intended reading
# (testdata/reading/expected.tsv). Run from the project root:
#   Rscript tools/reference/reading.R
out <- "testdata/reading"
cw <- ChickWeight
# whole numbers with a thousands separator, as a spreadsheet's "#,##0" format writes them
grouped <- function(x, mark) formatC(x, format = "d", big.mark = mark, decimal.mark = if (mark == ".") "," else ".")
states <- data.frame(state = state.name, region = state.region, Population = state.x77[, "Population"],
                     Income = state.x77[, "Income"], Area = state.x77[, "Area"])
states_grouped <- function(mark) transform(states, Population = grouped(Population, mark), Income = grouped(Income, mark),
                                           Area = grouped(Area, mark))
files <- list(
  # write.csv as R writes it: quoted row names in an unnamed first column
  list(file = "morley.csv", write = function(f) write.csv(morley, f), group = "Expt", measure = "Speed", data = morley),
  # the two columns only, as a spreadsheet exports them
  list(file = "morley_expt_speed.csv", write = function(f) write.csv(morley[, c("Expt", "Speed")], f, row.names = FALSE),
       group = "Expt", measure = "Speed", data = morley),
  list(file = "npk.csv", write = function(f) write.csv(npk, f), group = "block", measure = "yield", data = npk),
  # tab-separated with a decimal comma, as a spreadsheet in many locales saves it
  list(file = "npk_decimal_comma.tsv", write = function(f) write.table(npk, f, sep = "\t", dec = ",", row.names = FALSE, quote = FALSE),
       group = "block", measure = "yield", data = npk),
  # an export with an id column and text group labels
  list(file = "chickweight_id_diet_weight.csv",
       write = function(f) write.csv(data.frame(id = seq_len(nrow(cw)), Diet = paste("Diet", cw$Diet), weight = cw$weight), f, row.names = FALSE),
       group = "Diet", measure = "weight", data = cw),
  # every column, the measure first: the reading must be chosen by name
  list(file = "chickweight.csv", write = function(f) write.csv(cw, f, row.names = FALSE), group = "Diet", measure = "weight", data = cw,
       automatic = "offered"),
  list(file = "orchardsprays.csv", write = function(f) write.csv(OrchardSprays, f, row.names = FALSE),
       group = "treatment", measure = "decrease", data = OrchardSprays),
  # thousands separators: a comma in a comma-separated file (the cells quoted), a point in a semicolon-separated
  # one (as spreadsheets in decimal-comma locales save it), and a comma in a tab-separated paste where most speeds
  # are below 1,000 and the rest ("1,070") could be read as decimal commas
  list(file = "states_thousands_comma.csv", write = function(f) write.csv(states_grouped(","), f, row.names = FALSE),
       group = "region", measure = "Income", data = states, automatic = "offered"),
  list(file = "states_thousands_point.csv", write = function(f) write.csv2(states_grouped("."), f, row.names = FALSE),
       group = "region", measure = "Income", data = states, automatic = "offered"),
  # the source of testdata/sheets/warpbreaks_merged.xlsx (tools/reference/sheets.py)
  list(file = "warpbreaks.csv", write = function(f) write.csv(warpbreaks, f, row.names = FALSE),
       group = "tension", measure = "breaks", data = warpbreaks, automatic = "offered"),
  list(file = "morley_thousands_comma.tsv",
       write = function(f) write.table(transform(morley, Speed = grouped(Speed, ",")), f, sep = "\t", quote = FALSE, row.names = FALSE),
       group = "Expt", measure = "Speed", data = morley)
)
rows <- character()
for (x in files) {
  # automatic: whether the reading without a choice takes the intended columns ("taken") or names them
  # among its other readings ("offered")
  automatic <- if (is.null(x$automatic)) "taken" else x$automatic
  x$write(file.path(out, x$file))
  k <- kruskal.test(x$data[[x$measure]], factor(x$data[[x$group]]))
  rows <- c(rows, paste(x$file, x$group, x$measure, length(unique(x$data[[x$group]])), sum(!is.na(x$data[[x$measure]])),
                        sprintf("%.15g", k$statistic), k$parameter, sprintf("%.15g", k$p.value),
                        sprintf("%.15g", sum(x$data[[x$measure]], na.rm = TRUE)), automatic,
                        paste("R", getRversion(), "kruskal.test and sum"), sep = "\t"))
}
writeLines(c("file\tgroup\tmeasure\tk\tn\th\tdf\tp\tsum\tautomatic\tsource", rows), file.path(out, "expected.tsv"))
