# Shared helpers for the R scripts that generate tests/fixtures/stats/*.json.
# Run from the repository root:  Rscript scripts/r/<name>.R
suppressPackageStartupMessages({
  library(jsonlite)
})
fixture_dir <- "tests/fixtures/stats"
# The script that is running (Rscript passes it as --file=scripts/r/<name>.R): fixtures name the
# file that really generates them, not one derived from the fixture's own name.
running_script <- function() {
  file <- sub("^--file=", "", grep("^--file=", commandArgs(trailingOnly = FALSE), value = TRUE))
  if (length(file) != 1) stop("run the fixture scripts with Rscript scripts/r/<name>.R")
  sub("\\.R$", "", basename(file))
}
write_fixture <- function(name, value, script = running_script()) {
  value$generated_by <- paste0("scripts/r/", script, ".R with ", R.version.string)
  writeLines(toJSON(value, digits = NA, auto_unbox = TRUE, pretty = TRUE, null = "null", na = "null"),
             file.path(fixture_dir, paste0(name, ".json")))
}
write_data <- function(name, data) {
  write.csv(data, file.path(fixture_dir, paste0(name, ".csv")), row.names = FALSE, na = "NA")
}
