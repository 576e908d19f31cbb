# Reference values for the noncentrality interval behind the Cohen's d / Hedges' g intervals:
# for an observed t on df, the ncp values at which t is the 1 - alpha/2 and alpha/2 quantile of the
# noncentral t, found with R's uniroot on pt(t, df, ncp). Hedges' J(df) = gamma(df/2) / (sqrt(df/2) gamma((df-1)/2)).
# Run from the repository root: Rscript test/reference/effect-size/generate-ci.R
cases <- list(c(2.3, 12, 0.05), c(-0.7, 40, 0.05), c(6.1, 5, 0.05), c(1.2, 87, 0.05), c(3.4, 28, 0.10), c(0.4, 150, 0.01))
f <- function(x) sprintf("%.16g", x)
rows <- character(0)
for (cs in cases) {
  t <- cs[1]; df <- cs[2]; alpha <- cs[3]
  lo <- uniroot(function(n) pt(t, df, n) - (1 - alpha / 2), c(t - 20, t + 20), tol = 1e-14)$root
  hi <- uniroot(function(n) pt(t, df, n) - alpha / 2, c(t - 20, t + 20), tol = 1e-14)$root
  j <- exp(lgamma(df / 2) - lgamma((df - 1) / 2)) / sqrt(df / 2)
  rows <- c(rows, sprintf('    {"t": %s, "df": %s, "alpha": %s, "ncpLower": %s, "ncpUpper": %s, "hedgesJ": %s}', f(t), f(df), f(alpha), f(lo), f(hi), f(j)))
}
out <- c('{', sprintf('  "tool": "R %s", "functions": "uniroot(pt(t, df, ncp) - p, tol = 1e-14); exp(lgamma(df/2) - lgamma((df-1)/2)) / sqrt(df/2)",', paste(R.version$major, R.version$minor, sep = ".")),
         '  "cases": [', paste(rows, collapse = ',\n'), '  ]', '}')
writeLines(out, "test/reference/effect-size/ci.json")
