# Reference values of the distribution functions, from R's own implementations.
source("scripts/r/helpers.R")
grid <- function(...) expand.grid(..., KEEP.OUT.ATTRS = FALSE, stringsAsFactors = FALSE)

normal <- data.frame(x = c(-38, -20, -10, -6, -3, -1.5, -0.6, -1e-9, 0, 0.3, 0.67, 1, 2.5, 5.5, 8))
normal$lower <- pnorm(normal$x)
normal$upper <- pnorm(normal$x, lower.tail = FALSE)
normal_q <- data.frame(p = c(1e-300, 1e-20, 1e-10, 1e-4, 0.01, 0.025, 0.1, 0.3, 0.5, 0.7, 0.975, 0.999, 1 - 1e-12))
normal_q$q <- qnorm(normal_q$p)

t_grid <- grid(t = c(-40, -8, -4.06212768338204, -2, -0.5, 0.1, 1, 2.5, 6, 25), df = c(1, 2.5, 9, 30, 66, 1e4))
t_grid$lower <- pt(t_grid$t, t_grid$df)
t_grid$upper <- pt(t_grid$t, t_grid$df, lower.tail = FALSE)
t_q <- grid(p = c(1e-10, 0.0005, 0.005, 0.025, 0.05, 0.1, 0.4, 0.9, 0.95, 0.975, 0.995), df = c(1, 2, 3, 4.7, 9, 15, 30, 120, 1e5))
t_q$q <- qt(t_q$p, t_q$df)

f_grid <- grid(f = c(0.01, 0.5, 1, 2.5, 5, 14.4374999999998, 34.7022820554917, 100, 1e4), df1 = c(1, 3, 5, 11), df2 = c(2, 9, 66, 500, 1e5))
f_grid$lower <- pf(f_grid$f, f_grid$df1, f_grid$df2)
f_grid$upper <- pf(f_grid$f, f_grid$df1, f_grid$df2, lower.tail = FALSE)
f_q <- grid(alpha = c(0.01, 0.05, 0.1), df1 = c(1, 3, 5, 11), df2 = c(3, 9, 15, 66, 1000))
f_q$q <- qf(f_q$alpha, f_q$df1, f_q$df2, lower.tail = FALSE)

chisq <- grid(x = c(0.001, 0.5, 2, 3.2, 8.84615384615385, 20, 80, 300), df = c(1, 2, 3, 5, 11, 40))
chisq$lower <- pchisq(chisq$x, chisq$df)
chisq$upper <- pchisq(chisq$x, chisq$df, lower.tail = FALSE)

lgam <- data.frame(x = c(1e-5, 0.1, 0.5, 1, 1.5, 2, 3.7, 9.99, 10, 33.3, 500, 1e6))
lgam$lgamma <- lgamma(lgam$x)

tukey <- grid(q = c(0.3, 1, 2, 3, 3.5, 4.5, 6, 9), nmeans = c(2, 3, 5, 10, 20, 40), df = c(2, 5, 9, 20, 66, 120, 1000, 30000))
tukey$lower <- ptukey(tukey$q, tukey$nmeans, tukey$df)
tukey$upper <- ptukey(tukey$q, tukey$nmeans, tukey$df, lower.tail = FALSE)
tukey_q <- grid(p = c(0.9, 0.95, 0.99), nmeans = c(2, 3, 4, 6, 10, 20, 40), df = c(3, 5, 10, 20, 60, 120))
tukey_q$q <- qtukey(tukey_q$p, tukey_q$nmeans, tukey_q$df)

ncf <- grid(q = c(0.5, 1.5, 3, 6), df1 = c(1, 3, 7, 39), df2 = c(4, 12, 45, 400), ncp = c(0, 0.5, 5, 20, 80))
ncf$lower <- pf(ncf$q, ncf$df1, ncf$df2, ncp = ncf$ncp)
ncf$upper <- pf(ncf$q, ncf$df1, ncf$df2, ncp = ncf$ncp, lower.tail = FALSE)

write_fixture("distributions", list(
  r_calls = c(
    "pnorm(x); pnorm(x, lower.tail = FALSE); qnorm(p)",
    "pt(t, df); pt(t, df, lower.tail = FALSE); qt(p, df)",
    "pf(f, df1, df2); pf(f, df1, df2, lower.tail = FALSE); qf(alpha, df1, df2, lower.tail = FALSE)",
    "pchisq(x, df); pchisq(x, df, lower.tail = FALSE); lgamma(x)",
    "ptukey(q, nmeans, df); ptukey(q, nmeans, df, lower.tail = FALSE); qtukey(p, nmeans, df)",
    "pf(q, df1, df2, ncp = ncp); pf(q, df1, df2, ncp = ncp, lower.tail = FALSE)"),
  normal = normal, normalQuantile = normal_q, t = t_grid, tQuantile = t_q, f = f_grid, fQuantile = f_q,
  chiSquare = chisq, logGamma = lgam, tukey = tukey, tukeyQuantile = tukey_q, noncentralF = ncf))
