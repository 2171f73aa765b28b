# R values for the @example of every lib/stats doc comment that states a statistical result
# (tests/stats/doc-examples.test.ts checks the printed outputs against them).
# Run from the repository root: Rscript scripts/r/doc-examples.R
source("scripts/r/helpers.R")
suppressPackageStartupMessages({ library(emmeans); library(car); library(multcomp) })
emm_options(msg.interaction = FALSE)

latin <- data.frame(y = c(10, 12, 15, 11, 16, 9, 14, 8, 13),
                    treatment = c("A", "B", "C", "B", "C", "A", "C", "A", "B"),
                    row = rep(c("R1", "R2", "R3"), each = 3), column = rep(c("C1", "C2", "C3"), 3))
latinTable <- anova(lm(y ~ row + column + treatment, data = latin))
combined <- data.frame(y = c(10, 12, 11, 14, 7, 8, 9, 11), trt = rep(c("a", "b"), 4),
                       block = c("1", "1", "2", "2", "1", "1", "2", "2"), site = rep(c("S1", "S2"), each = 4))
combinedTable <- anova(lm(terms(y ~ site + site:block + trt + site:trt, keep.order = TRUE), data = combined))
ms <- combinedTable$"Mean Sq"
# Sites random: site is tested against block(site), treatment against site:treatment.
combinedF <- c(ms[1] / ms[2], ms[2] / ms[5], ms[3] / ms[4], ms[4] / ms[5])
combinedDf <- combinedTable$Df
combinedP <- c(pf(combinedF[1], combinedDf[1], combinedDf[2], lower.tail = FALSE),
               pf(combinedF[2], combinedDf[2], combinedDf[5], lower.tail = FALSE),
               pf(combinedF[3], combinedDf[3], combinedDf[4], lower.tail = FALSE),
               pf(combinedF[4], combinedDf[4], combinedDf[5], lower.tail = FALSE))

# Hardness RCBD (Montgomery; tests/fixtures/stats/reference/hardness_rcbd.csv): tips are
# treatments, coupons blocks. The designs', comparisons' and tests' examples use it.
hardness <- read.csv("tests/fixtures/stats/reference/hardness_rcbd.csv", colClasses = c("character", "character", "numeric"))
hardness$tip <- factor(hardness$tip); hardness$coupon <- factor(hardness$coupon)
hardnessFit <- lm(hardness ~ coupon + tip, data = hardness)
hardnessTable <- anova(hardnessFit)
hardnessEmm <- emmeans(hardnessFit, ~tip)
none <- summary(pairs(hardnessEmm, adjust = "none"))
tukey <- summary(pairs(hardnessEmm, adjust = "tukey"))
dfError <- df.residual(hardnessFit)
# TOST of tip2 against tip1 with margin 0.2: two one-sided t-tests on the emmeans contrast.
tost <- summary(contrast(hardnessEmm, method = "trt.vs.ctrl", ref = 1, adjust = "none"))[1, ]
margin <- 0.2
levene <- leveneTest(hardness ~ tip, data = hardness, center = median)
friedman <- friedman.test(hardness$hardness, hardness$tip, hardness$coupon)

# Sleep data (tests/fixtures/stats/reference/sleep_paired.csv = datasets::sleep).
sleep <- read.csv("tests/fixtures/stats/reference/sleep_paired.csv", colClasses = c("character", "character", "numeric"))
paired <- t.test(sleep$extra[sleep$drug == "drug1"], sleep$extra[sleep$drug == "drug2"], paired = TRUE)
welch <- t.test(c(1, 2, 3, 4), c(2, 4, 6, 8, 10))

# least-squares means of a 2-block RCBD with one lost plot: L (X'X)^-1 L' (residual df 0, so
# the unscaled covariance is what can be compared).
lostPlot <- data.frame(y = c(1, 3, 2), block = factor(c("B1", "B1", "B2")), trt = factor(c("a", "b", "a")))
lostFit <- lm(y ~ block + trt, data = lostPlot)
linfct <- emmeans(lostFit, ~trt)@linfct
lostCovariance <- linfct %*% summary(lostFit)$cov.unscaled %*% t(linfct)

# Noncentral F: R's pf(ncp =) uses pnbeta with an error bound of 1e-9, so the Poisson mixture of
# central beta probabilities (each from pbeta, accurate to about 1e-15) is the sharper reference.
noncentralSeries <- function(f, df1, df2, ncp, lower = TRUE) {
  j <- 0:1000
  sum(dpois(j, ncp / 2) * pbeta(df1 * f / (df1 * f + df2), df1 / 2 + j, df2 / 2, lower.tail = lower))
}
# blocksNeeded: 6 treatments, CV 15%, difference 30% of the mean, alpha 0.05, 8 blocks.
blocksDf1 <- 5; blocksDf2 <- 5 * 7; blocksNcp <- 8 * (30 / 15)^2 / 2
blocksCritical <- qf(0.95, blocksDf1, blocksDf2)
blocksPower7 <- noncentralSeries(qf(0.95, 5, 30), 5, 30, 7 * 4 / 2, lower = FALSE)

# Taylor's power law slope behind the assumptionAdvice example.
taylorSlope <- unname(coef(lm(log(c(2, 9, 33)) ~ log(c(2, 8, 30))))[2])

# Letters: multcomp's insert-absorb (the algorithm behind multcomp::cld) on the example's pattern
# (A-C and B-C significant), levels listed by decreasing mean.
letters <- multcomp:::insert_absorb(c("A-B" = FALSE, "A-C" = TRUE, "B-C" = TRUE), decreasing = FALSE,
                                    comps = rbind(c("A", "B"), c("A", "C"), c("B", "C")),
                                    lvl_order = c("A", "B", "C"), levels.x = c("A", "B", "C"))$Letters

stirlingSeries <- function(x) {
  k <- 1:8; bernoulli <- c(1/6, -1/30, 1/42, -1/30, 5/66, -691/2730, 7/6, -3617/510)
  sum(bernoulli / (2 * k * (2 * k - 1) * x^(2 * k - 1)))
}

examples <- list(
  compactLetterDisplay = list(call = "multcomp:::insert_absorb(c('A-B' = FALSE, 'A-C' = TRUE, 'B-C' = TRUE), decreasing = FALSE, levels.x = c('A', 'B', 'C'))$Letters",
                              letters = unname(letters)),
  fisherLsd = list(call = "qt(0.975, df.residual(fit)) * summary(pairs(emmeans(fit, ~tip)))$SE[1]; fit <- lm(hardness ~ coupon + tip)",
                   value = qt(0.975, dfError) * none$SE[1]),
  pairwiseComparisons = list(call = "summary(pairs(emmeans(fit, ~tip), adjust = 'none' | 'tukey'))[3, ]",
                             diff = none$estimate[3], se = none$SE[3], t = none$t.ratio[3], pLsd = none$p.value[3], pTukey = tukey$p.value[3]),
  backTransformValue = list(call = "100 * sin(0.5235987755982989)^2", value = 100 * sin(0.5235987755982989)^2),
  transformValue = list(call = "asin(sqrt(25 / 100))", value = asin(sqrt(25 / 100))),
  compensatedSum = list(call = "sum(c(1e16, 1, -1e16))  # R accumulates in long double", value = sum(c(1e16, 1, -1e16))),
  encodeFactor = list(call = "f <- factor(c('b', 'a', 'b')); levels(f); as.integer(f) - 1",
                      levels = levels(factor(c("b", "a", "b"))), codes = as.integer(factor(c("b", "a", "b"))) - 1),
  findRoot = list(call = "sqrt(2)", value = sqrt(2)),
  sumOfSquaredDeviations = list(call = "sum((c(1, 2, 3) - 2)^2)", value = sum((c(1, 2, 3) - 2)^2)),
  anovaTable = list(call = "10 / 2; 3 / 6; (10 / 2) / (3 / 6); pf(10, 2, 6, lower.tail = FALSE)",
                    ms = 10 / 2, msResidual = 3 / 6, f = (10 / 2) / (3 / 6), p = pf(10, 2, 6, lower.tail = FALSE)),
  fitCompletelyRandomized = list(call = "anova(lm(c(1, 2, 4, 5) ~ c('a', 'a', 'b', 'b')))",
                                 df = anova(lm(c(1, 2, 4, 5) ~ c("a", "a", "b", "b")))$Df[1],
                                 ss = anova(lm(c(1, 2, 4, 5) ~ c("a", "a", "b", "b")))$"Sum Sq"[1]),
  fitRandomizedCompleteBlock = list(call = "anova(lm(hardness ~ coupon + tip))$'Sum Sq'", ss = hardnessTable$"Sum Sq", df = hardnessTable$Df),
  groupMeans = list(call = "tapply(c(1, 2, 4), c(0, 0, 1), mean); table(c(0, 0, 1))",
                    means = unname(as.vector(tapply(c(1, 2, 4), c(0, 0, 1), mean))), counts = as.vector(table(c(0, 0, 1)))),
  leastSquaresMeans = list(call = "fit <- lm(y ~ block + trt); L <- emmeans(fit, ~trt)@linfct; L %*% coef(fit); L %*% summary(fit)$cov.unscaled %*% t(L)",
                           lsmeans = as.vector(linfct %*% coef(lostFit)), covariance = as.vector(t(lostCovariance))),
  chiSquareCdf = list(call = "pchisq(3.841458820694124, 1, lower.tail = FALSE)", value = pchisq(3.841458820694124, 1, lower.tail = FALSE)),
  fCdf = list(call = "pf(34.7022820554917, 5, 66, lower.tail = FALSE)", value = pf(34.7022820554917, 5, 66, lower.tail = FALSE)),
  fQuantile = list(call = "qf(0.95, 3, 9)", value = qf(0.95, 3, 9)),
  incompleteBeta = list(call = "pbeta(0.5, 2, 3); pbeta(0.5, 2, 3, lower.tail = FALSE)",
                        lower = pbeta(0.5, 2, 3), upper = pbeta(0.5, 2, 3, lower.tail = FALSE)),
  incompleteGamma = list(call = "pgamma(2, 1); pgamma(2, 1, lower.tail = FALSE)",
                         lower = pgamma(2, 1), upper = pgamma(2, 1, lower.tail = FALSE)),
  logBeta = list(call = "lbeta(0.5, 0.5)", value = lbeta(0.5, 0.5)),
  logGamma = list(call = "lgamma(0.5)", value = lgamma(0.5)),
  noncentralFCdf = list(call = "sum(dpois(0:1000, 5 / 2) * pbeta(9 / 21, 3 / 2 + 0:1000, 6)); pf(3, 3, 12, ncp = 5)",
                        value = noncentralSeries(3, 3, 12, 5), pf = pf(3, 3, 12, ncp = 5)),
  normalCdf = list(call = "pnorm(1.959963984540054)", value = pnorm(1.959963984540054)),
  normalQuantile = list(call = "qnorm(0.975)", value = qnorm(0.975)),
  stirlingCorrection = list(call = "sum(B2k / (2k (2k - 1) 10^(2k - 1))), k = 1..8; lgamma(10) - (9.5 * log(10) - 10 + log(2 * pi) / 2)",
                            value = stirlingSeries(10), fromLgamma = lgamma(10) - (9.5 * log(10) - 10 + log(2 * pi) / 2)),
  studentTCdf = list(call = "pt(2.228138851986274, 10); pt(2.228138851986274, 10, lower.tail = FALSE)",
                     lower = pt(2.228138851986274, 10), upper = pt(2.228138851986274, 10, lower.tail = FALSE)),
  studentTQuantile = list(call = "qt(0.975, 10)", value = qt(0.975, 10)),
  studentizedRangeCdf = list(call = "ptukey(3.5, 4, 20)", value = ptukey(3.5, 4, 20)),
  studentizedRangeQuantile = list(call = "qtukey(0.95, 3, 10)  # R's qtukey stops at eps = 1e-4", value = qtukey(0.95, 3, 10)),
  abbottCorrection = list(call = "100 * (90 - 20) / (100 - 20)", value = 100 * (90 - 20) / (100 - 20)),
  hendersonTilton = list(call = "100 * (1 - (5 * 40) / (50 * 60))", value = 100 * (1 - (5 * 40) / (50 * 60))),
  perSquareFootToPerSquareMetre = list(call = "1 / 0.3048^2", value = 1 / 0.3048^2),
  perSquareMetreToPerSquareFoot = list(call = "100 * 0.3048^2", value = 100 * 0.3048^2),
  percentControl = list(call = "100 * (1 - 12 / 80)", value = 100 * (1 - 12 / 80)),
  plotYieldPerArea = list(call = "6.5 / 12 * 10000 / 1000; 6.5 / 12 / 0.45359237 * 4046.8564224",
                          tonnesPerHectare = 6.5 / 12 * 10000 / 1000, poundsPerAcre = 6.5 / 12 / 0.45359237 * 4046.8564224),
  quadratDensity = list(call = "mean(c(12, 8, 10, 14)) / 0.25", value = mean(c(12, 8, 10, 14)) / 0.25),
  unitConstants = list(call = "0.3048^2 * 43560", value = 0.3048^2 * 43560),
  weedControlEfficiency = list(call = "100 * (250 - 40) / 250", value = 100 * (250 - 40) / 250),
  weedIndex = list(call = "100 * (5.2 - 4.68) / 5.2", value = 100 * (5.2 - 4.68) / 5.2),
  blocksNeeded = list(call = "power(b) = sum(dpois(0:1000, b * 4 / 2) * pbeta(x, 5 / 2 + 0:1000, 5 (b - 1) / 2, lower.tail = FALSE)), x = 5 F / (5 F + 5 (b - 1)), F = qf(0.95, 5, 5 (b - 1)); b = 7 and 8",
                      blocks = 8, power = noncentralSeries(blocksCritical, blocksDf1, blocksDf2, blocksNcp, lower = FALSE),
                      powerWithSevenBlocks = blocksPower7, criticalF = blocksCritical),
  assumptionAdvice = list(call = "coef(lm(log(c(2, 9, 33)) ~ log(c(2, 8, 30))))[2]  # Taylor's power law slope", taylorSlope = taylorSlope),
  brownForsytheLevene = list(call = "car::leveneTest(hardness ~ tip, center = median)",
                             f = levene$"F value"[1], dfTreatment = levene$Df[1], dfResidual = levene$Df[2], p = levene$"Pr(>F)"[1]),
  equivalenceTost = list(call = "contrast(emmeans(fit, ~tip), 'trt.vs.ctrl', ref = 1)[1]; pt((d + 0.2) / se, 9, lower.tail = FALSE); pt((d - 0.2) / se, 9); d +- qt(0.95, 9) se",
                         diff = tost$estimate, se = tost$SE,
                         ci90 = c(tost$estimate - qt(0.95, dfError) * tost$SE, tost$estimate + qt(0.95, dfError) * tost$SE),
                         pLower = pt((tost$estimate + margin) / tost$SE, dfError, lower.tail = FALSE),
                         pUpper = pt((tost$estimate - margin) / tost$SE, dfError)),
  friedmanTest = list(call = "friedman.test(hardness, tip, coupon)",
                      chi2 = unname(friedman$statistic), df = unname(friedman$parameter), p = friedman$p.value),
  pairedTTest = list(call = "t.test(extra[drug == 'drug1'], extra[drug == 'drug2'], paired = TRUE)",
                     t = unname(paired$statistic), df = unname(paired$parameter), p = paired$p.value,
                     meanDiff = unname(paired$estimate), ci = as.vector(paired$conf.int)),
  welchTTest = list(call = "t.test(c(1, 2, 3, 4), c(2, 4, 6, 8, 10))",
                    t = unname(welch$statistic), df = unname(welch$parameter), p = welch$p.value,
                    meanDiff = unname(welch$estimate[1] - welch$estimate[2]), ci = as.vector(welch$conf.int)),
  analyzeTrial = list(call = "anova(lm(hardness ~ coupon + tip))['tip', ]",
                      df = hardnessTable$Df[2], ss = hardnessTable$"Sum Sq"[2], ms = hardnessTable$"Mean Sq"[2],
                      f = hardnessTable$"F value"[2], p = hardnessTable$"Pr(>F)"[2]))

write_fixture("doc_examples", list(
  r_calls = c("anova(lm(y ~ row + column + treatment))",
              "anova(lm(terms(y ~ site + site:block + trt + site:trt, keep.order = TRUE))); F for site = MS site / MS site:block, for trt = MS trt / MS site:trt",
              "examples: each entry's call (scripts/r/doc-examples.R)"),
  latin = c(as.list(latin), list(df = latinTable$Df, ss = latinTable$"Sum Sq", f = latinTable$"F value"[1:3], p = latinTable$"Pr(>F)"[1:3])),
  combined = c(as.list(combined), list(df = combinedDf, ss = combinedTable$"Sum Sq", f = combinedF, p = combinedP)),
  examples = examples))
