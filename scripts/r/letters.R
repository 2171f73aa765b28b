# Compact-letter-display reference: 15 treatments, unequal replication (3 to 8 plots), a CRD
# generated with set.seed(1504); R's Tukey-Kramer p-values for all 105 pairs.
# Run from the repository root: Rscript scripts/r/letters.R
source("scripts/r/helpers.R")
suppressPackageStartupMessages(library(emmeans))
set.seed(1504)
treatments <- sprintf("T%02d", 1:15)
n <- sample(3:8, 15, replace = TRUE)
centre <- 20 + 0.55 * (1:15) + rnorm(15, 0, 0.4)
d <- data.frame(treatment = rep(treatments, n))
d$y <- round(centre[match(d$treatment, treatments)] + rnorm(nrow(d), 0, 1.1), 2)
write_data("letters_unbalanced", d)
fit <- lm(y ~ treatment, data = d)
pairs_tukey <- as.data.frame(pairs(emmeans(fit, ~treatment), adjust = "tukey"))
sides <- do.call(rbind, strsplit(as.character(pairs_tukey$contrast), " - "))
alpha <- 0.05
stopifnot(min(abs(pairs_tukey$p.value - alpha)) > 1e-4)  # no pair sits on the edge of alpha
write_fixture("letters_unbalanced", list(
  data = "letters_unbalanced.csv",
  options = list(design = "crd", response = "y", treatment = "treatment", alpha = alpha),
  r_calls = c("set.seed(1504); n <- sample(3:8, 15, TRUE); ... (scripts/r/letters.R)",
              "fit <- lm(y ~ treatment); pairs(emmeans(fit, ~treatment), adjust = \"tukey\")"),
  n = as.list(setNames(n, treatments)),
  lsmeans = as.list(setNames(as.data.frame(emmeans(fit, ~treatment))$emmean, treatments)),
  comparisons = lapply(seq_len(nrow(pairs_tukey)), function(i) list(a = sides[i, 1], b = sides[i, 2], pTukey = pairs_tukey$p.value[i])),
  significantPairs = sum(pairs_tukey$p.value <= alpha)))
