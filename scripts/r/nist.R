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

# NIST StRD SiRstv and AtmWtAg (observed data; tests/fixtures/stats/nist_sirstv.csv and
# nist_atmwtag.csv, whose header comments say how they were transcribed and checked).
# Two cross-checks are stored: R's anova(lm()) in double precision, and an exact computation
# in which every value is scaled to an integer and shifted by a constant (so all sums below are
# exact integers in double precision and only the final divisions round). The exact values
# reproduce NIST's certified ones, which confirms the transcription of data and certified values.
observed <- list()
for (spec in list(list(name = "SiRstv", file = "nist_sirstv.csv", y = "resistance", scale = 1e4, shift = 1960000),
                  list(name = "AtmWtAg", file = "nist_atmwtag.csv", y = "ag_weight", scale = 1e7, shift = 1078681000))) {
  d <- read.csv(file.path(fixture_dir, spec$file), comment.char = "#", colClasses = "character")
  y <- as.numeric(d[[spec$y]])
  g <- factor(d$instrument)
  tab <- anova(lm(y ~ g))
  a <- round(y * spec$scale) - spec$shift                    # exact integers
  stopifnot(all(abs(a) < 1e5))
  n <- tabulate(g); total <- sum(a); N <- length(a)
  groupSums <- as.vector(tapply(a, g, sum))
  # SS_between = Σ S_j² / n_j - T² / N and SS_within = Σ a² - Σ S_j² / n_j, over a common denominator
  common <- prod(unique(n)) * N
  between <- sum(groupSums^2 * (common / n)) - total^2 * (common / N)
  within <- sum(a^2) * common - sum(groupSums^2 * (common / n))
  stopifnot(max(abs(c(between, within))) < 2^53)
  ssBetween <- between / common / spec$scale^2
  ssWithin <- within / common / spec$scale^2
  dfBetween <- nlevels(g) - 1; dfWithin <- N - nlevels(g)
  observed[[spec$name]] <- list(
    file = spec$file, n = N, response = spec$y,
    r = list(ssBetween = tab$"Sum Sq"[1], ssWithin = tab$"Sum Sq"[2], msBetween = tab$"Mean Sq"[1],
             msWithin = tab$"Mean Sq"[2], f = tab$"F value"[1], dfBetween = tab$Df[1], dfWithin = tab$Df[2]),
    exact = list(ssBetween = ssBetween, ssWithin = ssWithin, msBetween = ssBetween / dfBetween,
                 msWithin = ssWithin / dfWithin, f = (between / dfBetween) / (within / dfWithin),
                 rSquared = between / (between + within), residualSd = sqrt(ssWithin / dfWithin)))
}
write_fixture("nist_anova", list(r_calls = "anova(lm(as.numeric(y) ~ factor(treatment))); observed sets: anova(lm(y ~ factor(instrument))) and exact integer sums",
                                 sets = sets, observed = observed))
