# Between-subjects ANOVA: one-way (balanced, unbalanced), two-way unbalanced,
# three-way; Type II and III sums of squares with sum-to-zero contrasts.

# Interval convention for the t-based families: Bonferroni and Holm get
# Bonferroni intervals (each at 1 - alpha/m), BH unadjusted 1 - alpha intervals.
ci_alpha <- function(method, alpha, m) if (method == "bh") alpha else alpha / m
CI_NOTE <- "CI = estimate -/+ qt(1 - a/2, df) * se with a = alpha/m (bonferroni, holm) or alpha (bh), by formula"

# Pairwise comparisons for one factor of a one-way model, every method.
pairwise_rows <- function(d, outcome, group, methods, level = 0.95) {
  y <- d[[outcome]]; g <- d[[group]]; lv <- levels(g); k <- length(lv)
  fit <- aov(reformulate(group, outcome), data = d)
  mse <- deviance(fit) / df.residual(fit); dfe <- df.residual(fit)
  tk <- TukeyHSD(fit, group, conf.level = level)[[group]]
  m <- tapply(y, g, mean); v <- tapply(y, g, var); n <- tapply(y, g, length)
  pairs <- combn(lv, 2)
  unadj <- pairwise.t.test(y, g, p.adjust.method = "none", pool.sd = TRUE)$p.value
  rows <- list()
  for (method in methods) {
    adj <- if (method %in% c("bonferroni", "holm", "bh"))
      pairwise.t.test(y, g, p.adjust.method = if (method == "bh") "BH" else method, pool.sd = TRUE)$p.value
    for (j in seq_len(ncol(pairs))) {
      a <- pairs[1, j]; b <- pairs[2, j]
      est <- unname(m[a] - m[b])
      if (method == "games-howell") {
        se <- sqrt(v[a] / n[a] + v[b] / n[b])
        df <- (v[a] / n[a] + v[b] / n[b])^2 / ((v[a] / n[a])^2 / (n[a] - 1) + (v[b] / n[b])^2 / (n[b] - 1))
        t <- est / se
        half <- qtukey(level, k, df) / sqrt(2) * se
        rows[[length(rows) + 1]] <- list(factor = group, method = method, a = a, b = b, estimate = est, se = unname(se),
          statistic = unname(t), df = unname(df), p = NULL, pAdjusted = ptukey(abs(unname(t)) * sqrt(2), k, unname(df), lower.tail = FALSE),
          ciLower = unname(est - half), ciUpper = unname(est + half),
          source = sprintf("Games-Howell by formula: Welch se and df, ptukey(|t|*sqrt(2), k, df), qtukey(%g, k, df)", level))
        next
      }
      se <- sqrt(mse * (1 / n[a] + 1 / n[b])); t <- est / se
      p <- 2 * pt(-abs(t), dfe)
      check_close(p, unadj[b, a], sprintf("pooled t p %s-%s vs pairwise.t.test", a, b), 1e-9)
      if (method == "tukey") {
        r <- tk[paste(b, a, sep = "-"), ]
        check_close(-r[["diff"]], est, "Tukey diff")
        rows[[length(rows) + 1]] <- list(factor = group, method = method, a = a, b = b, estimate = est, se = unname(se),
          statistic = unname(t), df = dfe, p = NULL, pAdjusted = r[["p adj"]], ciLower = -r[["upr"]], ciUpper = -r[["lwr"]],
          source = sprintf("TukeyHSD(conf.level = %g) (Tukey-Kramer for unequal n); se = sqrt(MSE*(1/na+1/nb)) and t = estimate/se by formula", level))
      } else {
        half <- qt(1 - ci_alpha(method, 1 - level, ncol(pairs)) / 2, dfe) * se
        rows[[length(rows) + 1]] <- list(factor = group, method = method, a = a, b = b, estimate = est, se = unname(se),
          statistic = unname(t), df = dfe, p = unname(p), pAdjusted = adj[b, a], ciLower = unname(est - half), ciUpper = unname(est + half),
          source = sprintf("pairwise.t.test(pool.sd = TRUE, p.adjust.method = '%s'); estimate, se, t by formula; %s", if (method == "bh") "BH" else method, CI_NOTE))
      }
    }
  }
  rows
}

# Test rows from car::Anova on a between-subjects lm.
anova_rows <- function(fit, type) {
  a <- car::Anova(fit, type = type)
  a <- a[rownames(a) != "(Intercept)", ]
  res <- which(rownames(a) == "Residuals")
  sse <- a[res, "Sum Sq"]; dfe <- a[res, "Df"]
  terms <- setdiff(rownames(a), "Residuals")
  rows <- lapply(terms, function(t) list(term = t, statistic = "F", value = a[t, "F value"], df1 = a[t, "Df"], df2 = dfe,
    p = a[t, "Pr(>F)"], ss = a[t, "Sum Sq"], ms = a[t, "Sum Sq"] / a[t, "Df"], partialEtaSq = a[t, "Sum Sq"] / (a[t, "Sum Sq"] + sse),
    source = sprintf("car::Anova(type = %d), contr.sum; partialEtaSq = SS/(SS+SSE) by formula", type)))
  list(rows = rows, residual = list(ss = sse, df = dfe, ms = sse / dfe))
}

oneway_fixture <- function(name, description, seed, d0, outcome, group, methods, ss_type = 3, alpha = 0.05) {
  csv <- as_csv(d0); d <- read_back(csv, group)
  f <- reformulate(group, outcome)
  fit <- lm(f, data = d)
  ar <- anova_rows(fit, ss_type)
  row <- ar$rows[[1]]
  sst <- sum((d[[outcome]] - mean(d[[outcome]]))^2)
  row$etaSq <- row$ss / sst
  row$omegaSq <- (row$ss - row$df1 * ar$residual$ms) / (sst + ar$residual$ms)
  row$source <- paste(row$source, "; etaSq = SS/SST, omegaSq = (SS - df*MSE)/(SST + MSE) by formula")
  ow <- oneway.test(f, data = d, var.equal = FALSE)
  kw <- kruskal.test(f, data = d)
  welch <- list(term = group, statistic = "F", variant = "welch", value = unname(ow$statistic), df1 = unname(ow$parameter[1]),
                df2 = unname(ow$parameter[2]), p = ow$p.value, source = "oneway.test(var.equal = FALSE)")
  write_fixture(name, description, seed,
    c(sprintf("car::Anova(lm(%s ~ %s), type = %d) with options(contrasts = c('contr.sum','contr.poly'))", outcome, group, ss_type),
      "oneway.test(var.equal = FALSE)", "kruskal.test", "car::leveneTest(center = mean)", "car::leveneTest(center = median)",
      "shapiro.test(residuals(lm))", sprintf("TukeyHSD(aov(...), conf.level = %g)", 1 - alpha), "pairwise.t.test(pool.sd = TRUE, p.adjust.method = bonferroni|holm|BH)",
      "Games-Howell by formula with ptukey/qtukey", "F power: pf(qf(1-a,df1,df2), df1, df2, ncp = f^2*N, lower.tail = FALSE), f^2 = pes/(1-pes)"),
    list(design = "anova", outcome = outcome, between = list(group), alpha = alpha, ssType = ss_type,
         comparisons = lapply(methods, function(m) list(factor = group, method = m))),
    csv,
    list(
      n = nrow(d),
      descriptives = descriptives(d, outcome, group, 1 - alpha),
      tests = list(row, welch),
      residual = ar$residual,
      assumptions = c(variance_tests(f, d), list(normality = shapiro(residuals(fit)))),
      nonparametric = list(list(term = group, method = "kruskal-wallis", value = unname(kw$statistic), df = unname(kw$parameter),
                                p = kw$p.value, source = "kruskal.test")),
      comparisons = pairwise_rows(d, outcome, group, methods, 1 - alpha),
      power = list(power_f(group, row$partialEtaSq, row$df1, row$df2, nrow(d), alpha))
    ))
}

# --- one-way balanced: three advising formats, 12 students each --------------
local({
  seed <- 3201; set.seed(seed)
  d0 <- data.frame(advising = rep(c("standard", "cohort", "coach"), each = 12))
  d0$credits <- round(c(rnorm(12, 22.5, 4), rnorm(12, 25.1, 4.5), rnorm(12, 26.0, 6)), 1)
  d0 <- d0[sample(nrow(d0)), ]
  d0 <- rbind(d0[d0$advising == "standard", ][1, ], d0[!(seq_len(nrow(d0)) %in% which(d0$advising == "standard")[1]), ])
  d0 <- cbind(student = sprintf("A%03d", seq_len(nrow(d0))), d0)
  oneway_fixture("anova-oneway-balanced", "Advising pilot: first-year credits by advising format (3 formats x 12).",
                 seed, d0, "credits", "advising", c("tukey", "games-howell", "bonferroni", "holm", "bh"))
})

# --- one-way unbalanced: four residence types, unequal n and spread -----------
local({
  seed <- 3202; set.seed(seed)
  ns <- c(home = 15, hall = 9, shared = 11, family = 6)
  d0 <- data.frame(residence = rep(names(ns), ns))
  d0$gpa <- round(c(rnorm(15, 2.9, 0.45), rnorm(9, 3.2, 0.3), rnorm(11, 2.7, 0.6), rnorm(6, 3.0, 0.8)), 2)
  oneway_fixture("anova-oneway-unbalanced", "Term GPA by residence type (n = 15, 9, 11, 6): Tukey-Kramer and Games-Howell; Type II requested.",
                 seed, d0, "gpa", "residence", c("tukey", "games-howell", "holm"), ss_type = 2)
})

# --- one-way at alpha = 0.10: 90% simultaneous intervals and power at .10 -------
local({
  seed <- 3205; set.seed(seed)
  ns <- c(online = 10, evening = 14, weekend = 8)
  d0 <- data.frame(schedule = rep(names(ns), ns))
  d0$satisfaction <- round(c(rnorm(10, 3.8, 0.6), rnorm(14, 4.1, 0.5), rnorm(8, 3.5, 0.9)), 2)
  d0 <- d0[sample(nrow(d0)), ]
  oneway_fixture("anova-oneway-alpha-10", "Course satisfaction by schedule (n = 10, 14, 8) with alpha = 0.10: 90% intervals, power at .10.",
                 seed, d0, "satisfaction", "schedule", c("tukey", "games-howell", "bonferroni"), alpha = 0.10)
})

# Comparisons among the raw marginal groups of one factor in a factorial
# design, on the full model's residual MS and df (by formula; p.adjust, ptukey, qtukey).
marginal_rows <- function(d, outcome, factor, mse, dfe, methods, alpha) {
  y <- d[[outcome]]; g <- d[[factor]]; lv <- levels(g); k <- length(lv)
  m <- tapply(y, g, mean); n <- tapply(y, g, length); pairs <- combn(lv, 2)
  est <- m[pairs[1, ]] - m[pairs[2, ]]; se <- sqrt(mse * (1 / n[pairs[1, ]] + 1 / n[pairs[2, ]])); t <- est / se
  p <- 2 * pt(-abs(t), dfe)
  rows <- list()
  for (method in methods) {
    if (method == "games-howell") {
      v <- tapply(y, g, var); va <- v[pairs[1, ]] / n[pairs[1, ]]; vb <- v[pairs[2, ]] / n[pairs[2, ]]
      se_gh <- sqrt(va + vb); df_gh <- (va + vb)^2 / (va^2 / (n[pairs[1, ]] - 1) + vb^2 / (n[pairs[2, ]] - 1)); t_gh <- est / se_gh
      half <- qtukey(1 - alpha, k, df_gh) / sqrt(2) * se_gh
      for (j in seq_len(ncol(pairs))) rows[[length(rows) + 1]] <- list(factor = factor, method = method, a = pairs[1, j], b = pairs[2, j],
        estimate = unname(est[j]), se = unname(se_gh[j]), statistic = unname(t_gh[j]), df = unname(df_gh[j]), p = NULL,
        pAdjusted = ptukey(abs(unname(t_gh[j])) * sqrt(2), k, unname(df_gh[j]), lower.tail = FALSE),
        ciLower = unname(est[j] - half[j]), ciUpper = unname(est[j] + half[j]),
        source = "Games-Howell on the raw marginal groups by formula: Welch se and df, ptukey/qtukey")
      next
    }
    if (method == "tukey") {
      padj <- ptukey(abs(t) * sqrt(2), k, dfe, lower.tail = FALSE); half <- qtukey(1 - alpha, k, dfe) / sqrt(2) * se
      src <- "Tukey-Kramer on raw marginal means with the full model's residual MS and df, by formula with ptukey/qtukey"
    } else {
      padj <- p.adjust(p, if (method == "bh") "BH" else method); half <- qt(1 - ci_alpha(method, alpha, ncol(pairs)) / 2, dfe) * se
      src <- sprintf("t on raw marginal means with the full model's residual MS and df, by formula; p.adjust(method = '%s'); %s", if (method == "bh") "BH" else method, CI_NOTE)
    }
    for (j in seq_len(ncol(pairs))) rows[[length(rows) + 1]] <- list(factor = factor, method = method, a = pairs[1, j], b = pairs[2, j],
      estimate = unname(est[j]), se = unname(se[j]), statistic = unname(t[j]), df = dfe, p = if (method == "tukey") NULL else unname(p[j]),
      pAdjusted = unname(padj[j]), ciLower = unname(est[j] - half[j]), ciUpper = unname(est[j] + half[j]), source = src)
  }
  rows
}

factorial_fixture <- function(name, description, seed, d0, outcome, factors, ss_type, simple = FALSE, alpha = 0.05,
                              comparisons = list()) {
  csv <- as_csv(d0); d <- read_back(csv, factors)
  f <- reformulate(paste(factors, collapse = " * "), outcome)
  fit <- lm(f, data = d)
  ar <- anova_rows(fit, ss_type)
  terms <- vapply(ar$rows, `[[`, "", "term")
  expected <- list(
    n = nrow(d),
    descriptives = descriptives(d, outcome, factors, 1 - alpha),
    tests = ar$rows,
    residual = ar$residual,
    assumptions = c(variance_tests(f, d), list(normality = shapiro(residuals(fit)))),
    power = lapply(ar$rows, function(r) power_f(r$term, r$partialEtaSq, r$df1, r$df2, nrow(d), alpha))
  )
  calls <- c(sprintf("car::Anova(lm(%s), type = %d) with options(contrasts = c('contr.sum','contr.poly'))", deparse(f), ss_type),
             "car::leveneTest(y ~ a*b..., center = mean / median) across all cells", "shapiro.test(residuals(lm))",
             "F power: pf(qf(1-a,df1,df2), df1, df2, ncp = f^2*N, lower.tail = FALSE), f^2 = pes/(1-pes), N = rows used")
  if (simple) {
    mse <- ar$residual$ms
    se_rows <- list()
    for (by in factors) for (fac in setdiff(factors, by)) {
      jt <- as.data.frame(emmeans::joint_tests(fit, by = by))
      jt <- jt[jt[["model term"]] == fac, ]
      dfe <- ar$residual$df
      for (lev in levels(d[[by]])) {
        # joint_tests prints F rounded to 3 decimals, so the exact value comes
        # from the cell-means formula and is checked against it.
        sub <- d[d[[by]] == lev, ]
        m <- tapply(sub[[outcome]], sub[[fac]], mean); nn <- tapply(sub[[outcome]], sub[[fac]], length)
        ss <- sum(nn * (m - sum(nn * m) / sum(nn))^2)
        df1 <- length(m) - 1; fval <- ss / df1 / mse
        jrow <- jt[as.character(jt[[by]]) == lev, ]
        check_close(fval, jrow$F.ratio, sprintf("simple effect %s at %s=%s vs joint_tests", fac, by, lev), 2e-3)
        check_close(df1, jrow$df1, "simple effect df1")
        se_rows[[length(se_rows) + 1]] <- list(
          factor = fac, at = list(factor = by, level = lev), df1 = df1, df2 = dfe, ss = ss, value = fval,
          p = pf(fval, df1, dfe, lower.tail = FALSE),
          source = "SS = sum n_i (mean_i - weighted mean)^2 within the level, F against the full model's residual MS, by formula; checked against emmeans::joint_tests(full model, by = ...)")
      }
    }
    expected$simpleEffects <- se_rows
    calls <- c(calls, "simple effects by formula against the full model residual MS, cross-checked with emmeans::joint_tests(lm, by = <other factor>) (which rounds F to 3 decimals)")
  }
  if (length(comparisons)) {
    expected$comparisons <- do.call(c, lapply(comparisons, function(cm)
      marginal_rows(d, outcome, cm$factor, ar$residual$ms, ar$residual$df, cm$method, alpha)))
    calls <- c(calls, "comparisons on raw marginal means with the full model's residual MS (formula; p.adjust, ptukey, qtukey)")
  }
  plan <- list(design = "anova", outcome = outcome, between = as.list(factors), alpha = alpha, ssType = ss_type)
  if (length(comparisons)) plan$comparisons <- do.call(c, lapply(comparisons, function(cm) lapply(cm$method, function(m) list(factor = cm$factor, method = m))))
  write_fixture(name, description, seed, calls, plan, csv, expected)
}

# --- two-way unbalanced: course modality x term ------------------------------
twoway_data <- local({
  seed <- 3203; set.seed(seed)
  cells <- expand.grid(modality = c("in-person", "online", "hybrid"), term = c("fall", "spring"), stringsAsFactors = FALSE)
  ns <- c(14, 9, 11, 8, 13, 10)
  mu <- c(74, 69, 72, 76, 66, 75)
  d0 <- do.call(rbind, lapply(seq_len(nrow(cells)), function(i)
    data.frame(modality = cells$modality[i], term = cells$term[i], score = round(rnorm(ns[i], mu[i], 8), 1))))
  list(seed = seed, d0 = d0[sample(nrow(d0)), ])
})
factorial_fixture("anova-twoway-unbalanced-type3", "Course modality (3) x term (2), unbalanced cells (8-14): Type III, simple effects both ways.",
                  twoway_data$seed, twoway_data$d0, "score", c("modality", "term"), 3, simple = TRUE,
                  comparisons = list(list(factor = "modality", method = c("tukey", "holm", "bh"))))
factorial_fixture("anova-twoway-unbalanced-type2", "Same data as the Type III case, Type II sums of squares.",
                  twoway_data$seed, twoway_data$d0, "score", c("modality", "term"), 2)

# --- three-way between: cohort x pell eligibility x course load ---------------
threeway_data <- local({
  seed <- 3204; set.seed(seed)
  cells <- expand.grid(cohort = c("2024", "2025"), pell = c("yes", "no"), load = c("part", "three-quarter", "full"), stringsAsFactors = FALSE)
  ns <- c(7, 9, 8, 6, 10, 7, 8, 9, 6, 8, 7, 10)
  d0 <- do.call(rbind, lapply(seq_len(nrow(cells)), function(i) {
    m <- 2.8 + 0.15 * (cells$cohort[i] == "2025") - 0.2 * (cells$pell[i] == "yes") + 0.1 * match(cells$load[i], c("part", "three-quarter", "full")) +
      0.25 * (cells$pell[i] == "yes" && cells$load[i] == "full")
    data.frame(cohort = paste0("c", cells$cohort[i]), pell = cells$pell[i], load = cells$load[i], gpa = round(rnorm(ns[i], m, 0.5), 2))
  }))
  list(seed = seed, d0 = d0[sample(nrow(d0)), ])
})
factorial_fixture("anova-threeway-type3", "Cohort (2) x Pell eligibility (2) x course load (3), unbalanced (6-10 per cell): Type III.",
                  threeway_data$seed, threeway_data$d0, "gpa", c("cohort", "pell", "load"), 3,
                  comparisons = list(list(factor = "load", method = c("bonferroni", "games-howell"))))
factorial_fixture("anova-threeway-type2", "Same three-way data, Type II sums of squares.",
                  threeway_data$seed, threeway_data$d0, "gpa", c("cohort", "pell", "load"), 2)
