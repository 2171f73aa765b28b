# R values for the small doc-comment examples of fitLatinSquare and fitCombinedSites
# (lib/stats/designs/*.ts). Run from the repository root: Rscript scripts/r/doc-examples.R
source("scripts/r/helpers.R")
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
write_fixture("doc_examples", list(
  r_calls = c("anova(lm(y ~ row + column + treatment))",
              "anova(lm(terms(y ~ site + site:block + trt + site:trt, keep.order = TRUE))); F for site = MS site / MS site:block, for trt = MS trt / MS site:trt"),
  latin = c(as.list(latin), list(df = latinTable$Df, ss = latinTable$"Sum Sq", f = latinTable$"F value"[1:3], p = latinTable$"Pr(>F)"[1:3])),
  combined = c(as.list(combined), list(df = combinedDf, ss = combinedTable$"Sum Sq", f = combinedF, p = combinedP))), script = "doc-examples")
