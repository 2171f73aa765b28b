# Shared helpers for the R scripts that generate tests/fixtures/stats/*.json.
# Run from the repository root:  Rscript scripts/r/<name>.R
suppressPackageStartupMessages({
  library(jsonlite)
})
fixture_dir <- "tests/fixtures/stats"
write_fixture <- function(name, value, script = name) {
  value$generated_by <- paste0("scripts/r/", script, ".R with ", R.version.string)
  writeLines(toJSON(value, digits = NA, auto_unbox = TRUE, pretty = TRUE, null = "null", na = "null"),
             file.path(fixture_dir, paste0(name, ".json")))
}
write_data <- function(name, data) {
  write.csv(data, file.path(fixture_dir, paste0(name, ".csv")), row.names = FALSE, na = "NA")
}
