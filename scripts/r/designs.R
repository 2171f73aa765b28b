# Reference analyses for the designs (data generated here with set.seed and exported).
# Each fixture stores the data file name, the analysis options, the R calls and R's results.
source("scripts/r/helpers.R")
source("scripts/r/analysis-helpers.R")

# 1. RCBD, 6 treatments x 4 blocks, 3 lost plots (unbalanced: Tukey-Kramer, emmeans lsmeans)
set.seed(20240501)
d <- expand.grid(trt = paste0("T", 1:6), block = paste0("B", 1:4), stringsAsFactors = TRUE)
d$y <- round(50 + c(0, 3, -2, 6, 1, -4)[d$trt] + c(-3, 0, 2, 1)[d$block] + rnorm(nrow(d), 0, 3), 1)
d$y[c(5, 14, 22)] <- NA
write_data("rcbd_lost_plots", d)
dd <- na.omit(d)
fit <- lm(y ~ block + trt, data = dd)
doc <- expected_doc(fit, dd, dd$y, "trt", c("block", "treatment"))
# TOST against T1 with margin 3 (two one-sided t-tests on emmeans contrasts, residual MS and df)
con <- summary(contrast(emmeans(fit, ~trt), method = "trt.vs.ctrl", ref = 1, adjust = "none"))
df_res <- df.residual(fit); margin <- 3
doc$equivalence <- list(margin = margin, results = lapply(seq_len(nrow(con)), function(i) {
  dlt <- con$estimate[i]; se <- con$SE[i]
  p1 <- pt((dlt + margin) / se, df_res, lower.tail = FALSE); p2 <- pt((dlt - margin) / se, df_res)
  list(treatment = strsplit(as.character(con$contrast[i]), " - ")[[1]][1], reference = "T1", diff = dlt, se = se,
       ci90 = c(dlt - qt(0.95, df_res) * se, dlt + qt(0.95, df_res) * se), p = max(p1, p2), equivalent = max(p1, p2) < 0.05)
}))
doc$percentControl <- lapply(levels(dd$trt)[-1], function(l) list(treatment = l, percent = 100 * (1 - mean(dd$y[dd$trt == l]) / mean(dd$y[dd$trt == "T1"]))))
write_fixture("rcbd_lost_plots", list(data = "rcbd_lost_plots.csv",
  options = list(design = "rcbd", response = "y", treatment = "trt", block = "block", control = "T1", reference = "T1", margin = 3),
  r_calls = c("fit <- lm(y ~ block + trt, data = na.omit(d)); anova(fit)", "emm <- emmeans(fit, ~trt); pairs(emm, adjust = 'none'); pairs(emm, adjust = 'tukey')",
              "shapiro.test(residuals(fit)); car::leveneTest(y ~ trt, center = median)",
              "contrast(emm, 'trt.vs.ctrl', ref = 1, adjust = 'none'); TOST p = max(pt((d+3)/se, df, lower=F), pt((d-3)/se, df)); ci90 = d +- qt(0.95, df) se",
              "percent control = 100 * (1 - mean(y[trt == t]) / mean(y[trt == 'T1']))"),
  expected = doc))

# 2. Latin square 5 x 5 (complete) and the same square with one lost plot
set.seed(7)
sq <- outer(0:4, 0:4, function(r, c) (r + 2 * c) %% 5) + 1
d <- data.frame(row = factor(rep(paste0("R", 1:5), 5)), col = factor(rep(paste0("C", 1:5), each = 5)))
d$trt <- factor(paste0("T", as.vector(sq)))
d$y <- round(20 + c(0, 2, 4, -1, 3)[d$trt] + c(1, -1, 0, 2, -2)[d$row] + c(0, 1, -1, 0.5, -0.5)[d$col] + rnorm(25, 0, 1.2), 2)
write_data("latin_square", d)
fit <- lm(y ~ row + col + trt, data = d)
write_fixture("latin_square", list(data = "latin_square.csv",
  options = list(design = "latin", response = "y", treatment = "trt", row = "row", column = "col"),
  r_calls = c("fit <- lm(y ~ row + col + trt, data = d); anova(fit); emmeans(fit, ~trt); pairs(..., adjust = 'none' | 'tukey')"),
  expected = expected_doc(fit, d, d$y, "trt", c("row", "column", "treatment"))))
d2 <- d; d2$y[8] <- NA
write_data("latin_square_lost_plot", d2)
dd <- na.omit(d2)
fit <- lm(y ~ row + col + trt, data = dd)
write_fixture("latin_square_lost_plot", list(data = "latin_square_lost_plot.csv",
  options = list(design = "latin", response = "y", treatment = "trt", row = "row", column = "col"),
  r_calls = c("fit <- lm(y ~ row + col + trt, data = na.omit(d)); anova(fit); emmeans(fit, ~trt); pairs(...)"),
  expected = expected_doc(fit, dd, dd$y, "trt", c("row", "column", "treatment"))))

# 3. Combined over sites: 3 sites x 3 blocks x 5 treatments; treatment tested against site:treatment
set.seed(99)
d <- expand.grid(trt = paste0("T", 1:5), block = paste0("B", 1:3), site = paste0("S", 1:3), stringsAsFactors = TRUE)
d$y <- round(4 + c(0, 0.4, 0.8, -0.3, 0.2)[d$trt] + c(-0.5, 0, 0.6)[d$site] + rnorm(nrow(d), 0, 0.35) +
             rnorm(15, 0, 0.25)[as.integer(d$site) * 5 - 5 + as.integer(d$trt)], 3)
write_data("combined_sites", d)
fit <- lm(terms(y ~ site + site:block + trt + site:trt, keep.order = TRUE), data = d)
write_fixture("combined_sites", list(data = "combined_sites.csv",
  options = list(design = "rcbd", response = "y", treatment = "trt", block = "block", site = "site"),
  r_calls = c("fit <- lm(terms(y ~ site + site:block + trt + site:trt, keep.order = TRUE), data = d); anova(fit)",
              "F(site) = MS(site)/MS(site:block); F(trt) = MS(trt)/MS(site:trt) with pf(..., lower.tail = FALSE)",
              "emmeans(fit, ~trt) with SE scaled by sqrt(MS(site:trt)/MS(residual)); pairs(adjust = 'none'); p from pt/ptukey with df(site:trt)"),
  expected = expected_doc(fit, d, d$y, "trt", c("site", "block(site)", "treatment", "site:treatment"),
                          error_term = "site:treatment", error_of = list(site = "block(site)", treatment = "site:treatment"))))
d2 <- d; d2$y[c(4, 30)] <- NA
write_data("combined_sites_lost_plots", d2)
dd <- na.omit(d2)
fit <- lm(terms(y ~ site + site:block + trt + site:trt, keep.order = TRUE), data = dd)
write_fixture("combined_sites_lost_plots", list(data = "combined_sites_lost_plots.csv",
  options = list(design = "rcbd", response = "y", treatment = "trt", block = "block", site = "site"),
  r_calls = c("fit <- lm(terms(y ~ site + site:block + trt + site:trt, keep.order = TRUE), data = na.omit(d)); anova(fit) (sequential SS in this order)",
              "emmeans(fit, ~trt) (equal weights over site x block), SE scaled by sqrt(MS(site:trt)/MS(residual)), df = df(site:trt)"),
  expected = expected_doc(fit, dd, dd$y, "trt", c("site", "block(site)", "treatment", "site:treatment"),
                          error_term = "site:treatment", error_of = list(site = "block(site)", treatment = "site:treatment"))))

# 4. Transforms: sqrt on InsectSprays (CRD), log1p on Poisson counts (RCBD), asin-sqrt on percentages (CRD)
d <- data.frame(spray = InsectSprays$spray, count = InsectSprays$count)
write_data("insect_sprays", d)
y <- sqrt(d$count); fit <- lm(y ~ spray, data = d)
write_fixture("transform_sqrt", list(data = "insect_sprays.csv",
  options = list(design = "crd", response = "count", treatment = "spray", transform = "sqrt"),
  r_calls = c("y <- sqrt(count); fit <- lm(y ~ spray); anova(fit); emmeans(fit, ~spray); back-transformed = emmean^2"),
  expected = expected_doc(fit, d, y, "spray", c("treatment"), back = function(m) m^2)))
set.seed(31)
d <- expand.grid(trt = paste0("T", 1:4), block = paste0("B", 1:5), stringsAsFactors = TRUE)
d$weeds <- rpois(nrow(d), c(40, 12, 5, 2)[d$trt] * c(1, 1.3, 0.8, 1.1, 0.9)[d$block])
write_data("weed_counts_rcbd", d)
y <- log1p(d$weeds); fit <- lm(y ~ block + trt, data = d)
ranks_ok <- friedman.test(d$weeds, d$trt, d$block)
write_fixture("transform_log1p", list(data = "weed_counts_rcbd.csv",
  options = list(design = "rcbd", response = "weeds", treatment = "trt", block = "block", transform = "log1p"),
  r_calls = c("y <- log1p(weeds); fit <- lm(y ~ block + trt); anova(fit); emmeans; back-transformed = expm1(emmean)", "friedman.test(weeds, trt, block)"),
  expected = expected_doc(fit, d, y, "trt", c("block", "treatment"), back = function(m) expm1(m),
    friedman = list(chi2 = unname(ranks_ok$statistic), df = unname(ranks_ok$parameter), p = ranks_ok$p.value))))
set.seed(5)
d <- data.frame(trt = factor(rep(paste0("T", 1:4), c(5, 6, 5, 4))))
d$cover <- round(pmin(100, pmax(0, c(85, 40, 12, 3)[d$trt] + rnorm(nrow(d), 0, 6))), 1)
write_data("cover_percent_crd", d)
y <- asin(sqrt(d$cover / 100)); fit <- lm(y ~ trt, data = d)
write_fixture("transform_asin_sqrt", list(data = "cover_percent_crd.csv",
  options = list(design = "crd", response = "cover", treatment = "trt", transform = "asin-sqrt"),
  r_calls = c("y <- asin(sqrt(cover / 100)); fit <- lm(y ~ trt); anova(fit); emmeans; back-transformed = 100 * sin(emmean)^2"),
  expected = expected_doc(fit, d, y, "trt", c("treatment"), back = function(m) 100 * sin(m)^2)))

# 5. Friedman with ties (scores 1-5 in a complete RCBD)
set.seed(12)
d <- expand.grid(trt = paste0("T", 1:5), block = paste0("B", 1:6), stringsAsFactors = TRUE)
d$score <- pmin(5, pmax(1, round(c(2, 3, 3, 4, 2)[d$trt] + rnorm(nrow(d), 0, 0.8))))
write_data("scores_rcbd", d)
fr <- friedman.test(d$score, d$trt, d$block)
fit <- lm(score ~ block + trt, data = d)
write_fixture("friedman_ties", list(data = "scores_rcbd.csv",
  options = list(design = "rcbd", response = "score", treatment = "trt", block = "block"),
  r_calls = c("friedman.test(score, trt, block)", "fit <- lm(score ~ block + trt); anova(fit); emmeans; pairs"),
  expected = expected_doc(fit, d, d$score, "trt", c("block", "treatment"),
    friedman = list(chi2 = unname(fr$statistic), df = unname(fr$parameter), p = fr$p.value))))

# 6. Welch two-sample t-test
set.seed(3)
d <- data.frame(method = rep(c("hand", "robot"), c(8, 11)), minutes = round(c(rnorm(8, 30, 6), rnorm(11, 24, 2.5)), 2))
write_data("weeding_minutes", d)
tt <- t.test(minutes ~ method, data = d)
write_fixture("welch_t_test", list(data = "weeding_minutes.csv",
  options = list(design = "two-sample", response = "minutes", treatment = "method"),
  r_calls = c("t.test(minutes ~ method, data = d)  # Welch, 95% CI"),
  expected = list(tTest = list(a = "hand", b = "robot", t = unname(tt$statistic), df = unname(tt$parameter), p = tt$p.value,
                               meanDiff = unname(tt$estimate[1] - tt$estimate[2]), ci = as.vector(tt$conf.int)))))

# 7. Gomez & Gomez (1984) Table 2.5 rice yields (data and published ANOVA stated from memory), R on the same data
y <- c(5113,5398,5307,4678, 5346,5952,4719,4264, 5272,5713,5483,4749, 5164,4831,4986,4410, 4804,4848,4432,4748, 5254,4542,4919,4098)
d <- data.frame(rate = rep(c("25","50","75","100","125","150"), each = 4), rep = rep(as.character(1:4), 6), yield = y)
write_data("gomez_rcbd", d)
d$rate <- factor(d$rate, levels = c("25","50","75","100","125","150")); d$rep <- factor(d$rep)
fit <- lm(yield ~ rep + rate, data = d)
write_fixture("gomez_rcbd", list(data = "gomez_rcbd.csv",
  options = list(design = "rcbd", response = "yield", treatment = "rate", block = "rep"),
  r_calls = c("fit <- lm(yield ~ rep + rate); anova(fit); emmeans(fit, ~rate); pairs(...)"),
  published = list(source = "Gomez & Gomez (1984) Statistical Procedures for Agricultural Research, 2nd ed., Table 2.5-2.6 (from memory)",
                   ssReplication = 1944361, ssTreatment = 1198331, ssError = 1658376),
  expected = expected_doc(fit, d, d$yield, "rate", c("block", "treatment"))))
