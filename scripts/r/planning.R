# Blocks needed for an RCBD treatment F test (noncentral F, R's pf with ncp), plus measures and unit conversions.
source("scripts/r/helpers.R")
blocks_needed <- function(t, cv, diff_pct, alpha = 0.05, power = 0.8) {
  for (b in 2:200) {
    df1 <- t - 1; df2 <- (t - 1) * (b - 1); ncp <- b * (diff_pct / cv)^2 / 2
    fcrit <- qf(1 - alpha, df1, df2)
    pw <- pf(fcrit, df1, df2, ncp = ncp, lower.tail = FALSE)
    if (pw >= power) return(list(treatments = t, cvPercent = cv, differencePercent = diff_pct, alpha = alpha, targetPower = power,
                                 blocks = b, power = pw, dfResidual = df2, noncentrality = ncp, criticalF = fcrit))
  }
}
scenarios <- list(blocks_needed(6, 15, 30), blocks_needed(4, 20, 25), blocks_needed(10, 12, 20, 0.05, 0.9),
                  blocks_needed(3, 25, 40, 0.01, 0.8), blocks_needed(8, 10, 10), blocks_needed(2, 30, 50))
kg_per_plot <- 6.5; area <- 12
measures <- list(
  percentControl = list(treated = 12, check = 80, value = 100 * (1 - 12 / 80)),
  weedControlEfficiency = list(control = 250, treated = 40, value = 100 * (250 - 40) / 250),
  weedIndex = list(weedFree = 5.2, treated = 4.68, value = 100 * (5.2 - 4.68) / 5.2),
  abbott = list(treated = 90, control = 20, value = 100 * (90 - 20) / (100 - 20)),
  hendersonTilton = list(tb = 50, ta = 5, cb = 40, ca = 60, value = 100 * (1 - (5 * 40) / (50 * 60))),
  quadrat = list(counts = c(12, 8, 10, 14), area = 0.25, value = mean(c(12, 8, 10, 14)) / 0.25),
  yield = list(kg = kg_per_plot, area = area, tonnesPerHectare = kg_per_plot / area * 10000 / 1000,
               poundsPerAcre = kg_per_plot / area / 0.45359237 * 4046.8564224),
  perSquareFoot = list(value = 3, perSquareMetre = 3 / 0.3048^2))
write_fixture("planning_measures", list(
  r_calls = c("for (b in 2:200) { df1 <- t-1; df2 <- (t-1)*(b-1); ncp <- b*(d/cv)^2/2; power <- pf(qf(1-alpha, df1, df2), df1, df2, ncp = ncp, lower.tail = FALSE); stop at power >= target }",
              "measures: plain R arithmetic of the published formulas (see planning.R)"),
  scenarios = scenarios, measures = measures))
