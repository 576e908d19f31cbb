# Regenerates every R reference fixture in test/reference/fixtures/.
# Run from the repository root:  Rscript test/reference/r/generate.R
# Each script seeds its own generator, so the output is reproducible.
local({
  file_arg <- grep("^--file=", commandArgs(trailingOnly = FALSE), value = TRUE)
  R_DIR <<- if (length(file_arg)) dirname(normalizePath(sub("^--file=", "", file_arg[1]))) else "test/reference/r"
})
source(file.path(R_DIR, "helpers.R"))
for (script in c("t-tests.R", "anova-between.R", "anova-within.R", "regression.R")) {
  source(file.path(R_DIR, script))
}
