# Repeated-measures and mixed ANOVA through afex::aov_ez (Type III), with
# Mauchly's test, Greenhouse-Geisser, Huynh-Feldt (Lecoutre form) and
# lower-bound corrections, generalized eta squared, Friedman, paired comparisons.

# Long data: one row per subject x within cell. `effects(cell, subject_row)` gives the mean.
simulate_long <- function(subjects, within, mean_fn, subj_sd, noise_sd, digits = 1) {
  cells <- expand.grid(within, stringsAsFactors = FALSE)
  rows <- list()
  for (s in seq_len(nrow(subjects))) {
    u <- rnorm(1, 0, subj_sd); slope <- rnorm(1, 0, subj_sd / 2)
    for (i in seq_len(nrow(cells))) {
      mu <- mean_fn(subjects[s, , drop = FALSE], cells[i, , drop = FALSE]) + u + slope * (i - 1)
      rows[[length(rows) + 1]] <- cbind(subjects[s, , drop = FALSE], cells[i, , drop = FALSE],
                                        y = round(rnorm(1, mu, noise_sd * (1 + 0.35 * (i - 1))), digits))
    }
  }
  do.call(rbind, rows)
}

within_rows <- function(fit, d_complete, subject) {
  # car notes when HF epsilon exceeds 1; the fixture stores it uncapped and caps df and p, as car does.
  s <- withCallingHandlers(summary(fit$Anova, multivariate = FALSE), warning = function(w)
    if (grepl("HF eps > 1", conditionMessage(w))) invokeRestart("muffleWarning"))
  uni <- unclass(s$univariate.tests); uni <- uni[rownames(uni) != "(Intercept)", , drop = FALSE]
  adj <- unclass(s$pval.adjustments); sph <- unclass(s$sphericity.tests)
  ges <- fit$anova_table
  lapply(rownames(uni), function(t) {
    ss <- uni[t, "Sum Sq"]; df1 <- uni[t, "num Df"]; ess <- uni[t, "Error SS"]; df2 <- uni[t, "den Df"]; fv <- uni[t, "F value"]
    row <- list(term = t, statistic = "F", value = fv, df1 = df1, df2 = df2, p = uni[t, "Pr(>F)"], ss = ss, ms = ss / df1,
      errorSs = ess, errorDf = df2, partialEtaSq = ss / (ss + ess), generalizedEtaSq = ges[t, "ges"],
      source = "afex::aov_ez(type = 3) -> car summary(univariate tests); ges from afex anova_table; partialEtaSq = SS/(SS+errorSS) by formula")
    if (!is.null(sph) && t %in% rownames(sph)) {
      W <- sph[t, "Test statistic"]; pW <- sph[t, "p-value"]
      nerr <- df2 / df1; pp <- df1
      rho <- 1 - (2 * pp^2 + pp + 2) / (6 * pp * nerr)
      chi <- -nerr * rho * log(W); cdf <- pp * (pp + 1) / 2 - 1
      gg <- adj[t, "GG eps"]; hf_car <- adj[t, "HF eps"]
      hf <- ((nerr + 1) * pp * gg - 2) / (pp * (nerr - pp * gg))  # Lecoutre: (N - g + 1) in the numerator
      check_close(hf, hf_car, paste(t, "HF Lecoutre form vs car"))
      check_close(pf(fv, df1 * gg, df2 * gg, lower.tail = FALSE), adj[t, "Pr(>F[GG])"], paste(t, "GG p"))
      hf_used <- min(1, hf)
      check_close(pf(fv, df1 * hf_used, df2 * hf_used, lower.tail = FALSE), adj[t, "Pr(>F[HF])"], paste(t, "HF p"))
      # R's second-order term uses 3 * (number of within cells) where the
      # usual published series has 3 * (term df); pTermDf records the latter.
      p_cells <- length(unique(interaction(d_complete[names(fit$data$idata)], drop = TRUE)))
      w2 <- function(k) (pp + 2) * (pp - 1) * (pp - 2) * (2 * pp^3 + 6 * pp^2 + 3 * k + 2) / (288 * (nerr * pp * rho)^2)
      p1 <- pchisq(chi, cdf, lower.tail = FALSE); p2 <- pchisq(chi, cdf + 4, lower.tail = FALSE)
      check_close(p1 + w2(p_cells) * (p2 - p1), pW, paste(t, "Mauchly p vs car"))
      row$sphericity <- list(W = W, chiSq = chi, df = cdf, p = pW, pFirstOrder = p1, pTermDf = p1 + w2(pp) * (p2 - p1),
        source = "car summary.Anova.mlm Mauchly W and p (p includes the second-order term of mauchly.test); chiSq = -n*rho*log(W) with n = error df, rho = 1-(2p^2+p+2)/(6pn) by formula; pFirstOrder = pchisq(chiSq, df) by formula; pTermDf = the same second-order series with 3*(term df) in place of R's 3*(within cells), by formula")
      row$corrections <- list(
        gg = list(epsilon = gg, df1 = df1 * gg, df2 = df2 * gg, p = adj[t, "Pr(>F[GG])"]),
        hf = list(epsilon = hf, df1 = df1 * hf_used, df2 = df2 * hf_used, p = adj[t, "Pr(>F[HF])"]),
        lb = list(epsilon = 1 / df1, df1 = 1, df2 = df2 / df1, p = pf(fv, 1, df2 / df1, lower.tail = FALSE)),
        source = "car summary.Anova.mlm GG/HF epsilon and p (car 3.1.1 uses the Lecoutre N-g+1 form, verified by formula; HF epsilon reported uncapped, capped at 1 for df and p); lower bound 1/df1 by formula")
    }
    row
  })
}

# Paired t comparisons among the levels of one within factor (subjects complete).
within_comparisons <- function(d, outcome, subject, factor, methods, alpha = 0.05) {
  lv <- levels(d[[factor]]); pairs <- combn(lv, 2)
  wide <- tapply(d[[outcome]], list(d[[subject]], d[[factor]]), mean)
  rows <- list()
  for (method in methods) {
    pm <- if (method == "bh") "BH" else method
    dd <- d[order(d[[subject]]), ]
    adj <- pairwise.t.test(dd[[outcome]], dd[[factor]], p.adjust.method = pm, paired = TRUE)$p.value
    for (j in seq_len(ncol(pairs))) {
      a <- pairs[1, j]; b <- pairs[2, j]
      level <- 1 - ci_alpha(method, alpha, ncol(pairs))
      tt <- t.test(wide[, a], wide[, b], paired = TRUE, conf.level = level)
      rows[[length(rows) + 1]] <- list(factor = factor, method = method, a = a, b = b, estimate = unname(tt$estimate),
        se = unname(tt$stderr), statistic = unname(tt$statistic), df = unname(tt$parameter), p = tt$p.value, pAdjusted = adj[b, a],
        ciLower = tt$conf.int[1], ciUpper = tt$conf.int[2],
        source = sprintf("t.test(paired = TRUE, conf.level = %g) per pair (alpha/m for bonferroni and holm, alpha for bh); pairwise.t.test(paired = TRUE, p.adjust.method = '%s')", level, pm))
    }
  }
  rows
}

within_fixture <- function(name, description, seed, d0, outcome, subject, within, between = character(),
                           methods = character(), friedman = FALSE) {
  csv <- as_csv(d0); d <- read_back(csv, c(subject, between, within))
  n_cells <- prod(vapply(within, function(w) nlevels(d[[w]]), 1))
  ok <- tapply(!is.na(d[[outcome]]), d[[subject]], sum) == n_cells
  dropped <- names(ok)[!ok]
  dc <- droplevels(d[d[[subject]] %in% names(ok)[ok], ])
  fit <- afex::aov_ez(id = subject, dv = outcome, data = dc, between = if (length(between)) between else NULL, within = within,
                      type = 3, anova_table = list(es = "ges", correction = "none"))
  # `excluded` counts rows with a missing outcome plus subjects then lacking a cell (the contract's documented count).
  expected <- list(subjects = sum(ok), excluded = sum(is.na(d[[outcome]])) + length(dropped),
                   descriptives = descriptives(dc, outcome, c(between, within)), tests = within_rows(fit, dc, subject))
  calls <- c(sprintf("afex::aov_ez(id = '%s', dv = '%s', between = %s, within = %s, type = 3, anova_table = list(es = 'ges', correction = 'none'))",
                     subject, outcome, deparse(between), deparse(within)),
             "summary(fit$Anova, multivariate = FALSE) (car::summary.Anova.mlm): univariate tests, Mauchly, GG/HF",
             "Huynh-Feldt (Lecoutre) epsilon = ((n+1) p gg - 2) / (p (n - p gg)), n = N - g, by formula = car's value",
             "lower bound epsilon 1/df1 and its p by formula",
             "cell mean, sd, length on complete subjects; se and 95% t interval by formula")
  if (length(dropped)) calls <- c(calls, sprintf("subjects with a missing cell dropped listwise before the fit: %s", paste(dropped, collapse = ", ")))
  if (friedman) {
    fr <- friedman.test(reformulate(paste(within, "|", subject), outcome), data = dc)
    expected$nonparametric <- list(list(term = within, method = "friedman", value = unname(fr$statistic), df = unname(fr$parameter),
                                        p = fr$p.value, source = "friedman.test(y ~ w | subject)"))
    calls <- c(calls, "friedman.test(y ~ w | subject)")
  }
  if (length(methods)) {
    expected$comparisons <- within_comparisons(dc, outcome, subject, within[1], methods)
    calls <- c(calls, "t.test(paired = TRUE) and pairwise.t.test(paired = TRUE) for comparisons")
  }
  write_fixture(name, description, seed, calls,
    c(list(design = "anova", outcome = outcome),
      if (length(between)) list(between = as.list(between)),
      list(within = as.list(within), subject = subject, alpha = 0.05),
      if (length(methods)) list(comparisons = lapply(methods, function(m) list(factor = within[1], method = m)))),
    csv, expected)
}

# --- one within factor: four-wave belonging survey, 16 students, one incomplete -
local({
  seed <- 3301; set.seed(seed)
  subs <- data.frame(student = sprintf("B%02d", 1:16))
  d0 <- simulate_long(subs, list(wave = c("w1", "w2", "w3", "w4")),
                      function(s, c) c(w1 = 3.1, w2 = 3.3, w3 = 3.2, w4 = 3.6)[[c$wave]], subj_sd = 0.45, noise_sd = 0.25, digits = 2)
  names(d0)[names(d0) == "y"] <- "belonging"
  d0$belonging[d0$student == "B07" & d0$wave == "w3"] <- NA
  within_fixture("rm-one-within", "Student belonging survey, four waves (16 students; one missing wave 3, dropped listwise).",
                 seed, d0, "belonging", "student", "wave", methods = c("bonferroni", "holm", "bh"), friedman = TRUE)
})

# --- two within factors: task (2) x session (3), 14 students -----------------
local({
  seed <- 3302; set.seed(seed)
  subs <- data.frame(learner = sprintf("L%02d", 1:14))
  d0 <- simulate_long(subs, list(task = c("reading", "writing"), session = c("s1", "s2", "s3")),
                      function(s, c) 60 + 4 * (c$task == "writing") + c(s1 = 0, s2 = 3, s3 = 5)[[c$session]] - 2.5 * (c$task == "writing" && c$session == "s3"),
                      subj_sd = 6, noise_sd = 3.5)
  names(d0)[names(d0) == "y"] <- "score"
  within_fixture("rm-two-within", "Learning-centre skills check: task (reading, writing) x session (3), 14 learners.",
                 seed, d0, "score", "learner", c("task", "session"))
})

# --- mixed: tutoring group (9 vs 12) x midterm (3) ---------------------------
local({
  seed <- 3303; set.seed(seed)
  subs <- data.frame(student = sprintf("T%02d", 1:21), group = rep(c("tutored", "comparison"), c(9, 12)))
  d0 <- simulate_long(subs, list(midterm = c("m1", "m2", "m3")),
                      function(s, c) 68 + c(m1 = 0, m2 = 2, m3 = 3)[[c$midterm]] + (s$group == "tutored") * c(m1 = 0, m2 = 3, m3 = 6)[[c$midterm]],
                      subj_sd = 7, noise_sd = 4)
  names(d0)[names(d0) == "y"] <- "midterm_score"
  within_fixture("mixed-one-between", "Peer tutoring: tutored (9) vs comparison (12) across three midterms.",
                 seed, d0, "midterm_score", "student", "midterm", between = "group")
})

# --- mixed: campus (2) x programme (2) x wave (3), unbalanced groups ---------
local({
  seed <- 3304; set.seed(seed)
  ns <- c(5, 7, 6, 8)
  g <- expand.grid(campus = c("north", "riverside"), programme = c("bridge", "regular"), stringsAsFactors = FALSE)
  subs <- do.call(rbind, lapply(1:4, function(i) g[rep(i, ns[i]), ]))
  subs <- data.frame(student = sprintf("M%02d", seq_len(nrow(subs))), subs, row.names = NULL)
  d0 <- simulate_long(subs, list(wave = c("fall", "winter", "spring")),
                      function(s, c) 3.0 + 0.2 * (s$campus == "north") + c(fall = 0, winter = 0.15, spring = 0.3)[[c$wave]] +
                        0.25 * (s$programme == "bridge") * (c$wave != "fall"),
                      subj_sd = 0.4, noise_sd = 0.22, digits = 2)
  names(d0)[names(d0) == "y"] <- "engagement"
  within_fixture("mixed-two-between", "Engagement index: campus (2) x programme (2) between, wave (3) within; groups of 5-8 students.",
                 seed, d0, "engagement", "student", "wave", between = c("campus", "programme"))
})
