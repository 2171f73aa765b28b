# R's one-way ANOVA of the small data set in tests/stats/cli-errors.test.ts (options validation:
# numbers and decimal strings must give the same table). Run from the repository root:
# Rscript scripts/r/option-validation.R
source("scripts/r/helpers.R")
d <- data.frame(t = c("A", "A", "B", "B"), y = c(1, 2, 3, 5))
tab <- anova(lm(y ~ t, data = d))
write_fixture("option_validation", list(
  r_calls = "anova(lm(y ~ t, data = data.frame(t = c('A', 'A', 'B', 'B'), y = c(1, 2, 3, 5))))",
  t = d$t, y = d$y, df = tab$Df, ss = tab$"Sum Sq", ms = tab$"Mean Sq", f = tab$"F value"[1], p = tab$"Pr(>F)"[1]))
