# NIST StRD one-way ANOVA sets SmLs01-SmLs09, built from their published description
# (9 treatments; in each, a first value c then alternating c - 0.1, c + 0.1; treatment
# centres 1.4, 1.3, 1.5, 1.3, 1.5, 1.3, 1.5, 1.3, 1.5; 21 / 201 / 2001 values per treatment;
# SmLs04-06 add 1e6, SmLs07-09 add 1e12). The data are written as decimal strings.
# R's lm/anova on the same data is stored for cross-checking (R is exact on 01-06 only).
source("scripts/r/helpers.R")
centres <- c("0.4", "0.3", "0.5", "0.3", "0.5", "0.3", "0.5", "0.3", "0.5")
minus <- c("0.3", "0.2", "0.4", "0.2", "0.4", "0.2", "0.4", "0.2", "0.4")
plus <- c("0.5", "0.4", "0.6", "0.4", "0.6", "0.4", "0.6", "0.4", "0.6")
sets <- list()
for (k in 1:9) {
  per <- c(21, 201, 2001)[(k - 1) %% 3 + 1]
  prefix <- c("1", "1000000", "1000000000000")[(k - 1) %/% 3 + 1]
  trt <- c(); val <- c()
  for (j in 1:9) {
    v <- c(centres[j], rep(c(minus[j], plus[j]), (per - 1) / 2))
    trt <- c(trt, rep(as.character(j), per)); val <- c(val, paste0(prefix, ".", substring(v, 3)))
  }
  name <- sprintf("SmLs%02d", k)
  d <- data.frame(treatment = trt, y = val)
  write.csv(d, file.path(fixture_dir, paste0("nist_", tolower(name), ".csv")), row.names = FALSE, quote = TRUE)
  tab <- anova(lm(as.numeric(y) ~ factor(treatment), data = d))
  sets[[name]] <- list(file = paste0("nist_", tolower(name), ".csv"), n = nrow(d),
    r = list(ssBetween = tab$"Sum Sq"[1], ssWithin = tab$"Sum Sq"[2], f = tab$"F value"[1]))
}
write_fixture("nist_anova", list(r_calls = "anova(lm(as.numeric(y) ~ factor(treatment)))", sets = sets))
