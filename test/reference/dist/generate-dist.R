# Reference values for Assayer's distribution layer (shared/stats/dist) and power
# module (shared/stats/power.ts), computed with base R's stats package.
# Run from the repository root:  Rscript test/reference/dist/generate-dist.R
# Writes JSON beside this script with 16 significant digits; the specs load them.
suppressPackageStartupMessages(library(jsonlite))
set.seed(20261201) # grids are fixed; the seed is recorded for completeness
out_dir <- "test/reference/dist"
meta <- list(tool = "R", version = R.version.string, package = "stats", jsonlite = as.character(packageVersion("jsonlite")), seed = 20261201,
             generated = format(Sys.time(), "%Y-%m-%dT%H:%M:%SZ", tz = "UTC"))
# jsonlite prints at most 15 digits, so numbers go out verbatim as %.16g.
verbatim <- function(x) {
  if (is.data.frame(x)) { for (n in names(x)) if (is.numeric(x[[n]])) x[[n]] <- verbatim(x[[n]]); return(x) }
  if (is.list(x)) return(lapply(x, verbatim))
  if (is.numeric(x)) return(structure(sprintf("%.16g", x), class = "json"))
  x
}
write_fixture <- function(x, name) {
  write(toJSON(verbatim(c(list(meta = meta), x)), json_verbatim = TRUE, auto_unbox = TRUE, pretty = FALSE),
        file.path(out_dir, name))
}
expand <- function(...) expand.grid(..., KEEP.OUT.ATTRS = FALSE, stringsAsFactors = FALSE)

# --- central distributions: functions pt, qt, pf, qf, pchisq, qchisq, pnorm, qnorm
probs <- c(1e-12, 1e-6, 0.001, 0.025, 0.05, 0.1, 0.3, 0.5, 0.7, 0.9, 0.95, 0.975, 0.999, 1 - 1e-6)
tdf <- c(1, 1.5, 2, 3, 5, 10, 29.7, 100, 1000, 1e4, 1e5, 1e6)
tp <- expand(df = tdf, x = c(-40, -5, -2.1, -0.5, 0, 0.3, 1, 1.96, 2.5, 4, 8, 30))
tp$lower <- pt(tp$x, tp$df); tp$upper <- pt(tp$x, tp$df, lower.tail = FALSE)
tq <- expand(df = tdf, p = probs); tq$q <- qt(tq$p, tq$df)

fdf1 <- c(1, 2, 3, 5, 10, 50, 1000, 1e6); fdf2 <- c(1, 2, 5, 27, 100, 1e4, 1e6)
fp <- expand(df1 = fdf1, df2 = fdf2, x = c(0.01, 0.5, 1, 1.001, 2, 4.85, 20, 200))
fp$lower <- pf(fp$x, fp$df1, fp$df2); fp$upper <- pf(fp$x, fp$df1, fp$df2, lower.tail = FALSE)
fq <- expand(df1 = fdf1, df2 = fdf2, p = c(0.01, 0.5, 0.95, 0.999)); fq$qf <- qf(fq$p, fq$df1, fq$df2)
# qf switches to a chi-square approximation when a df exceeds 4e5 (see ?qf source),
# so the reference quantile is pf inverted tightly, starting from qf.
fq$q <- mapply(function(p, df1, df2, q0) {
  g <- if (p < 0.5) function(x) pf(x, df1, df2) - p else function(x) (1 - p) - pf(x, df1, df2, lower.tail = FALSE)
  uniroot(g, c(q0 * 0.9, q0 * 1.1), tol = q0 * 1e-15, maxiter = 5000)$root
}, fq$p, fq$df1, fq$df2, fq$qf)

cdf <- c(1, 2, 3, 7.5, 10, 100, 1000, 1e4, 1e5, 1e6)
cp <- expand(df = cdf, m = c(0.01, 0.5, 0.9, 1, 1.1, 1.5, 3))
cp$x <- cp$df * cp$m
cp$lower <- pchisq(cp$x, cp$df); cp$upper <- pchisq(cp$x, cp$df, lower.tail = FALSE)
cq <- expand(df = cdf, p = probs); cq$q <- qchisq(cq$p, cq$df)

np <- data.frame(x = c(-37, -20, -8, -3, -1.96, -1, -0.1, 0, 0.5, 1.64, 2.5, 6, 12, 30))
np$lower <- pnorm(np$x); np$upper <- pnorm(np$x, lower.tail = FALSE)
nq <- data.frame(p = c(1e-300, 1e-20, probs, 1 - 1e-12)); nq$q <- qnorm(nq$p)

write_fixture(list(functions = "pt qt pf qf pchisq qchisq pnorm qnorm",
                   t = list(p = tp, q = tq), f = list(p = fp, q = fq),
                   chisq = list(p = cp, q = cq), normal = list(p = np, q = nq)),
              "central.json")

# --- studentized range: ptukey; quantiles both from qtukey (secant search with
# eps = 1e-4) and from uniroot on ptukey to 1e-13, the latter being R's cdf inverted tightly
kp <- expand(k = c(2, 3, 5, 10, 20), df = c(2, 5, 10, 20, 60, 1000, 1e5),
             q = c(0.5, 1, 2, 3.5, 5, 8))
kp$lower <- ptukey(kp$q, kp$k, kp$df)
kq <- expand(k = c(2, 3, 5, 10, 20), df = c(2, 5, 10, 20, 120, 1000), p = c(0.5, 0.95, 0.99))
kq$qtukey <- qtukey(kq$p, kq$k, kq$df)
kq$q <- mapply(function(p, k, df, q0) uniroot(function(q) ptukey(q, k, df) - p,
                                               c(q0 * 0.9, q0 * 1.1), tol = 1e-13)$root,
               kq$p, kq$k, kq$df, kq$qtukey)
write_fixture(list(functions = "ptukey qtukey uniroot", p = kp, q = kq), "studentized-range.json")

# --- noncentral t and F: pt(ncp =), pf(ncp =)
ntp <- expand(df = c(1, 3, 10, 30, 100, 1000, 1e5, 1e6), ncp = c(-3, 0, 0.5, 1, 2.5, 5, 10, 30),
              x = c(-3, -1, 0, 1, 2, 4, 8, 20))
ntp$lower <- suppressWarnings(pt(ntp$x, ntp$df, ntp$ncp))
ntp$upper <- suppressWarnings(pt(ntp$x, ntp$df, ntp$ncp, lower.tail = FALSE))
nfp <- expand(df1 = c(1, 2, 3, 5, 10), df2 = c(5, 27, 100, 1000, 1e5), ncp = c(0.5, 2, 9, 30, 100, 500),
              x = c(0.5, 1, 2, 3.35, 6, 15))
nfp$lower <- pf(nfp$x, nfp$df1, nfp$df2, nfp$ncp)
nfp$upper <- pf(nfp$x, nfp$df1, nfp$df2, nfp$ncp, lower.tail = FALSE)
write_fixture(list(functions = "pt(ncp) pf(ncp)", t = ntp, f = nfp), "noncentral.json")

# --- handbook critical values checked by R (the test names the printed table)
crit <- list(
  t = data.frame(df = c(1, 2, 5, 10, 20, 30, 60, 120)),
  f = data.frame(df1 = c(1, 2, 3, 4, 5, 1), df2 = c(10, 27, 20, 30, 60, 120)),
  q = data.frame(k = c(2, 3, 3, 4, 5, 6, 10, 4), df = c(10, 10, 20, 20, 30, 24, 60, 60)))
crit$t$r <- qt(0.975, crit$t$df)
crit$f$r <- qf(0.95, crit$f$df1, crit$f$df2)
crit$q$r <- mapply(function(k, df) uniroot(function(q) ptukey(q, k, df) - 0.95, c(2, 8), tol = 1e-13)$root,
                   crit$q$k, crit$q$df)
write_fixture(list(functions = "qt qf ptukey", critical = crit), "critical.json")

# --- power: power.t.test (strict = TRUE counts both rejection regions) and
# the noncentral F power pf(qf(1 - a, df1, df2), df1, df2, ncp = f^2 N, lower = FALSE)
pt_cases <- expand(type = c("one.sample", "two.sample", "paired"), n = c(8, 20, 64), d = c(0.2, 0.5, 1.1),
                   alpha = c(0.05, 0.01))
pt_cases$power <- mapply(function(type, n, d, alpha)
  power.t.test(n = n, delta = d, sd = 1, sig.level = alpha, type = type, strict = TRUE)$power,
  pt_cases$type, pt_cases$n, pt_cases$d, pt_cases$alpha)
pt_cases$detectable80 <- mapply(function(type, n, alpha)
  power.t.test(n = n, power = 0.8, sd = 1, sig.level = alpha, type = type, strict = TRUE, tol = 1e-12)$delta,
  pt_cases$type, pt_cases$n, pt_cases$alpha)
# unequal group sizes: power from the noncentral t directly (df = n1 + n2 - 2, ncp = d sqrt(n1 n2 / (n1 + n2)))
tpow <- function(d, n1, n2, alpha) {
  df <- n1 + n2 - 2; ncp <- d * sqrt(n1 * n2 / (n1 + n2)); cr <- qt(1 - alpha / 2, df)
  pt(cr, df, ncp, lower.tail = FALSE) + pt(-cr, df, ncp)
}
un <- expand(n1 = c(7, 30), n2 = c(13, 45), d = c(0.3, 0.9), alpha = 0.05)
un$power <- mapply(tpow, un$d, un$n1, un$n2, un$alpha)
un$detectable80 <- mapply(function(n1, n2, alpha)
  uniroot(function(d) tpow(d, n1, n2, alpha) - 0.8, c(1e-3, 10), tol = 1e-13)$root, un$n1, un$n2, un$alpha)
fpow <- function(f, df1, df2, N, alpha) pf(qf(1 - alpha, df1, df2), df1, df2, ncp = f^2 * N, lower.tail = FALSE)
fc <- data.frame(df1 = c(1, 2, 3, 2, 6, 4), df2 = c(18, 27, 36, 87, 108, 200), N = c(20, 30, 40, 90, 120, 210),
                 f = c(0.5, 0.3, 0.25, 0.4, 0.15, 0.1), alpha = c(0.05, 0.05, 0.01, 0.05, 0.05, 0.1))
fc$power <- mapply(fpow, fc$f, fc$df1, fc$df2, fc$N, fc$alpha)
fc$detectable80 <- mapply(function(df1, df2, N, alpha)
  uniroot(function(f) fpow(f, df1, df2, N, alpha) - 0.8, c(1e-3, 10), tol = 1e-13)$root,
  fc$df1, fc$df2, fc$N, fc$alpha)
write_fixture(list(functions = "power.t.test pt(ncp) pf(ncp) uniroot", t = pt_cases, tUnequal = un, f = fc),
              "power.json")

# --- p recomputed from reported statistics (reconciliation): two-sided for t and z,
# upper tail for F and chi-square, at the printed value and at the ends of its rounding interval
rc <- data.frame(
  stat = c("F", "t", "t", "chi2", "z", "t", "t", "F", "F", "t", "F"),
  df = c(NA, 28, 31.4, 3, NA, 20, 20, NA, NA, 26.3, NA),
  df1 = c(2, NA, NA, NA, NA, NA, NA, 1, 1.6, NA, 3),
  df2 = c(27, NA, NA, NA, NA, NA, NA, 38, 30.4, NA, 60),
  value = c(4.85, -2.10, 2.2, 7.9, 1.96, 2.10, 1.80, 5.2, 6.3, 2.2, 0.87),
  decimals = c(2, 2, 1, 1, 2, 2, 2, 1, 1, 1, 2), stringsAsFactors = FALSE)
pfun <- function(stat, df, df1, df2, v) switch(stat,
  t = 2 * pt(abs(v), df, lower.tail = FALSE), z = 2 * pnorm(abs(v), lower.tail = FALSE),
  F = pf(v, df1, df2, lower.tail = FALSE), chi2 = pchisq(v, df, lower.tail = FALSE))
h <- 0.5 * 10^(-rc$decimals)
rc$p <- mapply(pfun, rc$stat, rc$df, rc$df1, rc$df2, rc$value)
rc$pLow <- mapply(pfun, rc$stat, rc$df, rc$df1, rc$df2, abs(rc$value) + h)
rc$pHigh <- mapply(pfun, rc$stat, rc$df, rc$df1, rc$df2, pmax(abs(rc$value) - h, 0))
rc[is.na(rc)] <- -1 # absent df (JSON has no NA); the spec ignores them
write_fixture(list(functions = "pt pnorm pf pchisq", cases = rc), "reconcile.json")
