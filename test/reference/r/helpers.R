# Shared helpers for the reference generators: CSV round trip, fixture writer,
# provenance, and formula-based quantities R does not report directly.
suppressPackageStartupMessages({
  library(jsonlite)
  library(car)
  library(afex)
  library(emmeans)
})
options(contrasts = c("contr.sum", "contr.poly"))

# R_DIR is set by generate.R to this folder.
FIXTURE_DIR <- normalizePath(file.path(R_DIR, "..", "fixtures"), mustWork = TRUE)

# Render a data frame as CSV text, then read it back so R analyses exactly the
# numbers the engine will parse from the fixture.
as_csv <- function(df) {
  con <- textConnection("csv_lines", "w", local = TRUE)
  write.csv(df, con, row.names = FALSE, quote = FALSE, na = "NA")
  close(con)
  paste0(paste(csv_lines, collapse = "\n"), "\n")
}
read_back <- function(csv, factors = character()) {
  df <- read.csv(text = csv, stringsAsFactors = FALSE)
  # Level order = order of first appearance, the engine's rule for text labels.
  for (f in factors) df[[f]] <- factor(df[[f]], levels = unique(df[[f]]))
  df
}

provenance <- function(seed, calls) {
  list(
    r = R.version.string,
    packages = list(
      stats = as.character(packageVersion("stats")),
      car = as.character(packageVersion("car")),
      afex = as.character(packageVersion("afex")),
      emmeans = as.character(packageVersion("emmeans")),
      jsonlite = as.character(packageVersion("jsonlite"))
    ),
    contrasts = unname(options("contrasts")[[1]]),
    seed = seed,
    calls = calls
  )
}

write_fixture <- function(name, description, seed, calls, plan, csv, expected) {
  out <- list(
    name = name,
    description = description,
    generatedBy = "test/reference/r/generate.R",
    provenance = provenance(seed, calls),
    plan = plan,
    csv = csv,
    expected = expected
  )
  # jsonlite caps `digits = I(16)` at 15 significant digits, so numbers are
  # pre-rendered with %.16g and passed through verbatim.
  txt <- toJSON(num16(out), digits = I(16), auto_unbox = TRUE, na = "null", null = "null", pretty = TRUE, json_verbatim = TRUE)
  path <- file.path(FIXTURE_DIR, paste0(name, ".json"))
  writeLines(txt, path)
  cat("wrote", normalizePath(path), "\n")
}

num16 <- function(x) {
  if (is.list(x)) return(if (is.data.frame(x)) x else lapply(x, num16) |> structure(names = names(x)))
  if (is.numeric(x) && !is.factor(x)) {
    cell <- function(v) if (is.na(v)) "null" else if (v == round(v) && abs(v) < 1e15) sprintf("%.0f", v) else sprintf("%.16g", v)
    txt <- vapply(x, cell, "")
    return(structure(if (length(x) == 1 && is.null(names(x))) txt else paste0("[", paste(txt, collapse = ","), "]"), class = "json"))
  }
  x
}

check_close <- function(a, b, what, tol = 1e-10) {
  if (!isTRUE(all.equal(unname(a), unname(b), tolerance = tol)))
    stop(sprintf("formula check failed for %s: %s vs %s", what, format(a, digits = 17), format(b, digits = 17)))
}

# Variance tests: car::leveneTest with both centres, mapped onto Assumptions.
variance_tests <- function(formula, data) {
  one <- function(center, label) {
    lt <- car::leveneTest(formula, data = data, center = center)
    list(center = label, value = lt[1, "F value"], df1 = lt[1, "Df"], df2 = lt[2, "Df"], p = lt[1, "Pr(>F)"])
  }
  list(levene = one(mean, "mean"), brownForsythe = one(median, "median"))
}

shapiro <- function(x) {
  s <- shapiro.test(x)
  list(method = "shapiro-wilk", W = unname(s$statistic), p = s$p.value)
}

# Cell descriptives keyed by factor levels: n, mean, sd from R; se = sd/sqrt(n)
# and the t interval at `level`, mean -/+ qt(1 - (1 - level)/2, n - 1) * se, by formula.
descriptives <- function(data, outcome, factors, level = 0.95) {
  keys <- if (length(factors)) interaction(data[factors], drop = TRUE, lex.order = TRUE) else factor(rep("all", nrow(data)))
  lapply(split(seq_len(nrow(data)), keys), function(ix) {
    lv <- if (length(factors)) lapply(setNames(factors, factors), function(f) as.character(data[[f]][ix[1]])) else setNames(list(), character())
    y <- data[[outcome]][ix]
    se <- sd(y) / sqrt(length(y)); h <- qt(1 - (1 - level) / 2, length(y) - 1) * se
    list(levels = lv, n = length(y), mean = mean(y), sd = sd(y), se = se, ciLower = mean(y) - h, ciUpper = mean(y) + h)
  }) |> unname()
}

# Two-sided power of a t test from the noncentral t (both rejection tails).
t_power <- function(ncp_per_d, d, df, alpha) {
  crit <- qt(1 - alpha / 2, df)
  ncp <- d * ncp_per_d
  pt(crit, df, ncp, lower.tail = FALSE) + pt(-crit, df, ncp)
}
t_detectable <- function(ncp_per_d, df, alpha, target = 0.8) {
  uniroot(function(d) t_power(ncp_per_d, d, df, alpha) - target, c(1e-6, 50), tol = 1e-14)$root
}
# Power of an F test with Cohen's f: ncp = f^2 * N (N = observations used).
f_power <- function(f, df1, df2, N, alpha) {
  pf(qf(1 - alpha, df1, df2), df1, df2, ncp = f^2 * N, lower.tail = FALSE)
}
f_detectable <- function(df1, df2, N, alpha, target = 0.8) {
  uniroot(function(f) f_power(f, df1, df2, N, alpha) - target, c(1e-6, 50), tol = 1e-14)$root
}

# Power row for a t test; `check` (optional) re-derives power and detectable d
# with power.t.test and stops if the formula disagrees.
power_t <- function(term, d, ncp_per_d, df, alpha, check = NULL) {
  pw <- t_power(ncp_per_d, abs(d), df, alpha)
  det <- t_detectable(ncp_per_d, df, alpha)
  if (!is.null(check)) {
    check_close(check(abs(d), NULL)$power, pw, paste(term, "power vs power.t.test"), 1e-8)
    check_close(check(NULL, 0.8)$delta, det, paste(term, "detectable d vs power.t.test"), 1e-6)
  }
  list(term = term, metric = "d", observed = d, power = pw, detectable80 = det, alpha = alpha,
       source = "noncentral t (pt/qt) by formula; detectable by uniroot")
}
# Power row for an F test, f^2 = partial eta^2 / (1 - partial eta^2), ncp = f^2 * N.
power_f <- function(term, pes, df1, df2, N, alpha) {
  f <- sqrt(pes / (1 - pes))
  list(term = term, metric = "f", observed = f, power = f_power(f, df1, df2, N, alpha),
       detectable80 = f_detectable(df1, df2, N, alpha), alpha = alpha,
       source = "pf(qf(1-a,df1,df2), df1, df2, ncp = f^2*N, lower.tail = FALSE); detectable by uniroot")
}
