# One-sample, independent and paired designs: t tests, z test, variance tests,
# rank-based alternatives and t-test power.

# --- one-sample: first-year credits earned against a 24-credit benchmark ----
local({
  seed <- 3101; set.seed(seed)
  d0 <- data.frame(student = sprintf("S%03d", 1:28),
                   credits = round(rnorm(28, mean = 25.6, sd = 3.9), 1))
  csv <- as_csv(d0); d <- read_back(csv)
  x <- d$credits; mu <- 24; alpha <- 0.05
  tt <- t.test(x, mu = mu)
  dd <- (mean(x) - mu) / sd(x)
  n <- length(x)
  write_fixture("one-sample-t", "One-sample t on first-year credits earned versus a 24-credit benchmark.",
    seed, c("shapiro.test(credits)", "mean, sd, length; se and 95% t interval by formula", "t.test(credits, mu = 24); estimate and CI reported as mean - mu (t.test's estimate and conf.int minus mu)",
            "Cohen's d = (mean - mu) / sd by formula",
            "power: noncentral t by formula, pt(qt(1-a/2,df),df,ncp,lower=FALSE)+pt(-qt(1-a/2,df),df,ncp), ncp = d*sqrt(n); detectable d by uniroot; cross-checked with power.t.test(type='one.sample', strict=TRUE)"),
    list(design = "one-sample", outcome = "credits", mu = mu, alpha = alpha),
    csv,
    list(
      n = n,
      descriptives = descriptives(d, "credits", character()),
      assumptions = list(normality = shapiro(x)),
      tests = list(list(term = "mean", statistic = "t", value = unname(tt$statistic), df = unname(tt$parameter),
                        p = tt$p.value, estimate = unname(tt$estimate) - mu, ciLower = tt$conf.int[1] - mu, ciUpper = tt$conf.int[2] - mu,
                        cohensD = dd, source = "t.test(mu = 24); estimate and CI shifted by mu (mean - mu, the contract's convention); cohensD by formula")),
      power = list(power_t(term = "mean", d = dd, ncp_per_d = sqrt(n), df = n - 1, alpha = alpha,
                           check = function(delta, power) power.t.test(n = n, delta = delta, sd = 1, sig.level = alpha, type = "one.sample", strict = TRUE, tol = 1e-12, power = power)))
    ))
})

# --- one-sample with a known SD: z test computed by formula ------------------
local({
  seed <- 3102; set.seed(seed)
  d0 <- data.frame(section = sprintf("SEC%02d", 1:35),
                   placement = round(rnorm(35, mean = 71.8, sd = 9.5), 1))
  csv <- as_csv(d0); d <- read_back(csv)
  x <- d$placement; mu <- 70; sigma <- 10; n <- length(x)
  z <- (mean(x) - mu) / (sigma / sqrt(n))
  pz <- 2 * pnorm(-abs(z))
  tt <- t.test(x, mu = mu)
  write_fixture("one-sample-z", "One-sample z with a known population SD (placement scores, mu 70, sigma 10); the t test on the same data as well.",
    seed, c("z = (mean - mu) / (sigma / sqrt(n)) and p = 2 * pnorm(-|z|), by formula (base R has no z test)",
            "CI = (mean - mu) -/+ qnorm(0.975) * sigma / sqrt(n) by formula", "t.test(placement, mu = 70); estimate and CI reported as mean - mu", "mean, sd, length; se and 95% t interval by formula"),
    list(design = "one-sample", outcome = "placement", mu = mu, sigma = sigma, alpha = 0.05),
    csv,
    list(
      n = n,
      descriptives = descriptives(d, "placement", character()),
      tests = list(
        list(term = "mean", statistic = "z", value = z, p = pz, estimate = mean(x) - mu,
             ciLower = mean(x) - mu - qnorm(0.975) * sigma / sqrt(n), ciUpper = mean(x) - mu + qnorm(0.975) * sigma / sqrt(n),
             source = "z by formula with pnorm/qnorm; estimate = mean - mu"),
        list(term = "mean", statistic = "t", value = unname(tt$statistic), df = unname(tt$parameter), p = tt$p.value,
             estimate = unname(tt$estimate) - mu, ciLower = tt$conf.int[1] - mu, ciUpper = tt$conf.int[2] - mu,
             source = "t.test(mu = 70); estimate and CI shifted by mu"))
    ))
})

independent_fixture <- function(name, description, seed, d0, outcome, group, alpha = 0.05) {
  csv <- as_csv(d0); d <- read_back(csv, group)
  f <- reformulate(group, outcome)
  st <- t.test(f, data = d, var.equal = TRUE)
  we <- t.test(f, data = d, var.equal = FALSE)
  wt <- suppressWarnings(wilcox.test(f, data = d))
  lv <- levels(d[[group]])
  y1 <- d[[outcome]][d[[group]] == lv[1]]; y2 <- d[[outcome]][d[[group]] == lv[2]]
  n1 <- length(y1); n2 <- length(y2)
  sp <- sqrt(((n1 - 1) * var(y1) + (n2 - 1) * var(y2)) / (n1 + n2 - 2))
  dd <- (mean(y1) - mean(y2)) / sp
  exact <- grepl("exact", wt$method)
  row <- function(tt, variant) list(term = group, statistic = "t", variant = variant, value = unname(tt$statistic),
    df = unname(tt$parameter), p = tt$p.value, estimate = unname(tt$estimate[1] - tt$estimate[2]),
    ciLower = tt$conf.int[1], ciUpper = tt$conf.int[2], source = sprintf("t.test(var.equal = %s)", variant == "student"))
  tests <- list(row(st, "student"), row(we, "welch"))
  tests[[1]]$cohensD <- dd
  power <- NULL
  if (n1 == n2) {
    power <- list(power_t(term = group, d = dd, ncp_per_d = sqrt(n1 * n2 / (n1 + n2)), df = n1 + n2 - 2, alpha = alpha,
      check = function(delta, power) power.t.test(n = n1, delta = delta, sd = 1, sig.level = alpha, type = "two.sample", strict = TRUE, tol = 1e-12, power = power)))
  } else {
    power <- list(power_t(term = group, d = dd, ncp_per_d = sqrt(n1 * n2 / (n1 + n2)), df = n1 + n2 - 2, alpha = alpha))
  }
  write_fixture(name, description, seed,
    c("t.test(y ~ g, var.equal = TRUE)", "t.test(y ~ g, var.equal = FALSE)",
      "car::leveneTest(y ~ g, center = mean)", "car::leveneTest(y ~ g, center = median)",
      "shapiro.test(residuals(lm(y ~ g))) (values minus their group mean)",
      sprintf("wilcox.test(y ~ g) [%s; statistic W = U of the first level]", wt$method),
      "Cohen's d with pooled SD by formula",
      "power: noncentral t by formula, ncp = d*sqrt(n1*n2/(n1+n2)), df = n1+n2-2, both tails; detectable d by uniroot"),
    list(design = "independent", outcome = outcome, between = list(group), alpha = alpha),
    csv,
    list(
      n = nrow(d),
      levels = lv,
      descriptives = descriptives(d, outcome, group),
      tests = tests,
      assumptions = c(variance_tests(f, d), list(normality = shapiro(residuals(lm(f, data = d))))),
      nonparametric = list(list(term = group, method = "mann-whitney", value = unname(wt$statistic), p = wt$p.value,
                                exact = exact, source = paste("wilcox.test:", wt$method))),
      power = power
    ))
}

# --- independent, small, no ties: exact Mann-Whitney ----------------------
local({
  seed <- 3103; set.seed(seed)
  d0 <- data.frame(format = rep(c("cohort", "drop-in"), c(9, 8)))
  d0$hours <- round(c(rnorm(9, 14.2, 3.1), rnorm(8, 10.9, 4.6)), 2)
  while (anyDuplicated(d0$hours)) d0$hours <- round(d0$hours + runif(17, -0.01, 0.01), 2)
  independent_fixture("independent-small-exact", "Weekly study hours, cohort advising versus drop-in advising (9 vs 8, no ties): exact Mann-Whitney.",
                      seed, d0, "hours", "format")
})

# --- independent, larger, ties and unequal spread: normal-approximation U ---
local({
  seed <- 3104; set.seed(seed)
  d0 <- data.frame(campus = rep(c("north", "riverside"), c(42, 36)))
  d0$belonging <- c(round(rnorm(42, 3.6, 0.55) * 4) / 4, round(rnorm(36, 3.3, 0.95) * 4) / 4)
  d0 <- d0[c(1:5, 43:50, 6:42, 51:78), ]
  independent_fixture("independent-ties-approx", "Belonging scale (quarter-point steps) by campus, 42 vs 36 with ties: Student and Welch t, normal-approximation Mann-Whitney with continuity correction.",
                      seed, d0, "belonging", "campus")
})

# --- independent, equal n: power cross-checked with power.t.test --------------
local({
  seed <- 3105; set.seed(seed)
  d0 <- data.frame(section = rep(c("hybrid", "online"), each = 20))
  d0$final <- round(c(rnorm(20, 76, 8), rnorm(20, 70, 11)), 1)
  independent_fixture("independent-equal-n", "Final exam score, hybrid versus online sections (20 each).", seed, d0, "final", "section")
})

paired_fixture <- function(name, description, seed, first, last, alpha = 0.05) {
  level <- 1 - alpha
  n <- length(first)
  d0 <- data.frame(student = rep(sprintf("W%03d", 1:n), times = 2),
                   visit = rep(c("first", "last"), each = n),
                   essay = c(first, last))
  d0 <- d0[order(rep(1:n, 2), rep(1:2, each = n)), ]
  csv <- as_csv(d0); d <- read_back(csv, c("student", "visit"))
  x <- d$essay[d$visit == "first"][order(d$student[d$visit == "first"])]
  y <- d$essay[d$visit == "last"][order(d$student[d$visit == "last"])]
  tt <- t.test(x, y, paired = TRUE, conf.level = level)
  wt <- suppressWarnings(wilcox.test(x, y, paired = TRUE))
  # wilcox.test looks for ties in binary differences, where 72.4 - 69.3 and
  # 65.1 - 62.0 can differ in the last bit; on the decimal data they tie.
  dec <- abs(round(x - y, 8))
  if (grepl("exact", wt$method) && (anyDuplicated(dec) || any(dec == 0))) stop(paste(name, ": exact test chosen although the decimal differences tie"))
  dz <- mean(x - y) / sd(x - y)
  write_fixture(name, description, seed,
    c(sprintf("t.test(first, last, paired = TRUE, conf.level = %g)", level), "shapiro.test(first - last)", sprintf("per-visit mean, sd, length; se and %g t interval by formula", level), sprintf("wilcox.test(first, last, paired = TRUE) [%s; V = sum of positive ranks of first - last]", wt$method),
      "d_z = mean(diff) / sd(diff) by formula",
      "power: noncentral t by formula, ncp = dz*sqrt(n), df = n-1, both tails; cross-checked with power.t.test(type='paired', strict=TRUE)"),
    list(design = "paired", outcome = "essay", within = list("visit"), subject = "student", alpha = alpha),
    csv,
    list(
      n = nrow(d),
      descriptives = descriptives(d, "essay", "visit", level),
      assumptions = list(normality = shapiro(x - y)),
      tests = list(list(term = "visit", statistic = "t", variant = "paired", value = unname(tt$statistic), df = unname(tt$parameter),
                        p = tt$p.value, estimate = unname(tt$estimate), ciLower = tt$conf.int[1], ciUpper = tt$conf.int[2],
                        dz = dz, source = "t.test(paired = TRUE); dz by formula")),
      nonparametric = list(list(term = "visit", method = "wilcoxon", value = unname(wt$statistic), p = wt$p.value,
                                source = paste("wilcox.test(paired = TRUE):", wt$method))),
      power = list(power_t(term = "visit", d = dz, ncp_per_d = sqrt(n), df = n - 1, alpha = alpha,
        check = function(delta, power) power.t.test(n = n, delta = delta, sd = 1, sig.level = alpha, type = "paired", strict = TRUE, tol = 1e-12, power = power)))
    ))
}

# --- paired, 12 writers, no ties: exact signed-rank -----------------------
local({
  seed <- 3106; set.seed(seed)
  first <- round(rnorm(12, 62, 9), 1)
  gain <- round(rnorm(12, 4.5, 5), 1)
  gain[gain == 0] <- 0.3
  stopifnot(!anyDuplicated(abs(gain)))
  paired_fixture("paired-exact", "Writing-lab essay scores, first and last visit (12 students, distinct non-zero differences): exact signed-rank.",
                 seed, first, first + gain)
})

# --- paired, 30 writers, tied differences: normal-approximation signed-rank ----
local({
  seed <- 3107; set.seed(seed)
  first <- round(rnorm(30, 3.1, 0.6) * 2) / 2
  gain <- round(rnorm(30, 0.3, 0.7) * 2) / 2
  gain[gain == 0] <- 0.5
  paired_fixture("paired-ties-approx", "Rubric score (half-point steps), first and last visit (30 students, tied differences): normal-approximation signed-rank with continuity correction.",
                 seed, first, first + gain)
})

# --- paired at alpha = 0.01: intervals at 99% and power at .01 ------------------
local({
  seed <- 3108; set.seed(seed)
  first <- round(rnorm(18, 70, 8), 1)
  gain <- round(rnorm(18, 3.2, 4.5), 1)
  # Distinct non-zero differences, so the exact signed-rank test applies.
  while (anyDuplicated(abs(gain)) || any(gain == 0)) {
    i <- which(duplicated(abs(gain)) | gain == 0)[1]
    gain[i] <- gain[i] + 0.1
  }
  paired_fixture("paired-alpha-01", "Essay scores, first and last visit (18 students) with alpha = 0.01: 99% intervals, power at .01.",
                 seed, first, first + gain, alpha = 0.01)
})
