# The same analyses as the engine benchmark, in R, for a side-by-side time.
# Usage: Rscript test/bench/r-side.R between|within DATA.csv
# Prints one line: the seconds spent in read.csv plus the analysis (package loading excluded).
args <- commandArgs(trailingOnly = TRUE)
kind <- args[1]
path <- args[2]
options(contrasts = c("contr.sum", "contr.poly"))
if (kind == "between") {
  suppressPackageStartupMessages(library(car))
  t0 <- proc.time()[["elapsed"]]
  d <- read.csv(path, stringsAsFactors = TRUE)
  fit <- lm(y ~ f * g, data = d)
  a <- car::Anova(fit, type = 3)
  t1 <- proc.time()[["elapsed"]]
  stopifnot(nrow(a) == 5)
} else {
  suppressPackageStartupMessages(library(afex))
  t0 <- proc.time()[["elapsed"]]
  d <- read.csv(path, stringsAsFactors = TRUE)
  d$time <- factor(d$time)
  a <- afex::aov_ez(id = "id", dv = "y", data = d, within = "time")
  s <- summary(a)
  t1 <- proc.time()[["elapsed"]]
}
cat(sprintf("%.4f\n", t1 - t0))
