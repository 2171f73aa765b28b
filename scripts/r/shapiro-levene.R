# Shapiro-Wilk (AS R94, R's shapiro.test) for n = 3 .. 5000 and Brown-Forsythe Levene
# (car::leveneTest(center = median)) on unbalanced groups. Data generated here and exported.
source("scripts/r/helpers.R")
suppressPackageStartupMessages(library(car))
set.seed(2024)
samples <- list(
  n3 = c(2.1, 3.7, 3.9),
  n4 = round(rnorm(4), 3),
  n5 = round(rexp(5), 3),
  n6 = round(runif(6), 3),
  n7 = c(2.1, 3.4, 1.9, 5.6, 4.4, 3.3, 2.8),
  n11 = round(rexp(11), 4),
  n12 = round(rnorm(12, 10, 2), 4),
  n20 = round(rlnorm(20), 4),
  n100 = round(rnorm(100), 5),
  n1000 = round(rgamma(1000, 3), 5),
  n5000 = round(rnorm(5000), 6))
shapiro <- lapply(names(samples), function(name) {
  x <- samples[[name]]; r <- shapiro.test(x)
  list(name = name, values = x, w = unname(r$statistic), p = r$p.value)
})
g <- factor(rep(c("a", "b", "c", "d"), c(5, 8, 6, 9)))
y <- round(c(rnorm(5, 10, 1), rnorm(8, 12, 3), rnorm(6, 9, 0.5), rnorm(9, 15, 2)), 3)
lev <- leveneTest(y ~ g, center = median)
write_fixture("shapiro_levene", list(
  r_calls = c("shapiro.test(values)", "car::leveneTest(y ~ g, center = median)"),
  shapiro = shapiro,
  levene = list(groups = as.character(g), values = y, f = lev$"F value"[1], df1 = lev$Df[1], df2 = lev$Df[2], p = lev$"Pr(>F)"[1])))
