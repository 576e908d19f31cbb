# Multiple linear regression: coefficients, intervals, fit, overall F, VIF.

regression_fixture <- function(name, description, seed, d0, outcome, predictors) {
  csv <- as_csv(d0); d <- read_back(csv)
  f <- reformulate(predictors, outcome)
  fit <- lm(f, data = d); s <- summary(fit); ci <- confint(fit, level = 0.95)
  co <- s$coefficients; vif <- car::vif(fit); fs <- s$fstatistic
  coefs <- lapply(rownames(co), function(t) {
    r <- list(term = if (t == "(Intercept)") "(intercept)" else t, estimate = co[t, 1], se = co[t, 2], value = co[t, 3],
              df = fit$df.residual, p = co[t, 4], ciLower = ci[t, 1], ciUpper = ci[t, 2],
              source = "summary(lm)$coefficients, confint(lm)")
    if (t != "(Intercept)") { r$vif <- unname(vif[t]); r$source <- paste(r$source, "; car::vif") }
    r
  })
  write_fixture(name, description, seed,
    c(sprintf("lm(%s)", deparse(f)), "summary(lm): coefficients, r.squared, adj.r.squared, sigma, fstatistic", "confint(lm, level = 0.95)", "car::vif(lm)"),
    list(design = "regression", outcome = outcome, predictors = as.list(predictors), alpha = 0.05),
    csv,
    list(n = nrow(d), coefficients = coefs, rSquared = s$r.squared, adjRSquared = s$adj.r.squared, sigma = s$sigma,
         tests = list(list(term = "model", statistic = "F", value = unname(fs["value"]), df1 = unname(fs["numdf"]), df2 = unname(fs["dendf"]),
                           p = pf(fs["value"], fs["numdf"], fs["dendf"], lower.tail = FALSE) |> unname(),
                           source = "summary(lm)$fstatistic; p = pf(F, df1, df2, lower.tail = FALSE)"))))
}

# --- persistence index from entry characteristics, 64 students ----------------
local({
  seed <- 3401; set.seed(seed)
  n <- 64
  hs_gpa <- round(rnorm(n, 3.0, 0.45), 2)
  placement <- round(55 + 12 * (hs_gpa - 3) + rnorm(n, 0, 8))
  work_hours <- round(pmax(0, rnorm(n, 14, 8)))
  commute_km <- round(rexp(n, 1 / 12), 1)
  persistence <- round(40 + 9 * hs_gpa + 0.25 * placement - 0.35 * work_hours - 0.1 * commute_km + rnorm(n, 0, 5), 1)
  d0 <- data.frame(student = sprintf("P%03d", 1:n), hs_gpa, placement, work_hours, commute_km, persistence)
  regression_fixture("regression-four-predictors", "Persistence index on high-school GPA, placement score (correlated with GPA), weekly work hours and commute distance.",
                     seed, d0, "persistence", c("hs_gpa", "placement", "work_hours", "commute_km"))
})

# --- large-offset predictor: enrolment year and credits, 40 sections -----------
local({
  seed <- 3402; set.seed(seed)
  n <- 40
  year <- sample(2015:2025, n, replace = TRUE)
  size <- round(runif(n, 12, 45))
  pass_rate <- round(0.62 + 0.012 * (year - 2015) - 0.003 * (size - 25) + rnorm(n, 0, 0.05), 3)
  d0 <- data.frame(section = sprintf("R%02d", 1:n), year, size, pass_rate)
  regression_fixture("regression-year-offset", "Section pass rate on calendar year (large offset, 2015-2025) and section size.",
                     seed, d0, "pass_rate", c("year", "size"))
})
