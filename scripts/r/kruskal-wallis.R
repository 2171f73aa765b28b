# Kruskal-Wallis reference values (R's kruskal.test, which applies the tie correction):
# InsectSprays (counts with ties), an unbalanced 0-4 score trial with heavy ties, and the tiny
# example of the doc comment. Run from the repository root: Rscript scripts/r/kruskal-wallis.R
source("scripts/r/helpers.R")
kw <- function(test) list(chi2 = unname(test$statistic), df = unname(test$parameter), p = test$p.value)

d <- read.csv(file.path(fixture_dir, "insect_sprays.csv"), colClasses = c("character", "numeric"))
stopifnot(identical(d$count, as.numeric(InsectSprays$count)))
insect <- kw(kruskal.test(count ~ factor(spray), data = d))

set.seed(2024)
n <- c(T1 = 5, T2 = 7, T3 = 4, T4 = 6)
scores <- data.frame(treatment = rep(names(n), n), score = NA_integer_)
centre <- c(T1 = 1, T2 = 2, T3 = 2, T4 = 3)
scores$score <- pmin(4L, pmax(0L, as.integer(round(centre[scores$treatment] + rnorm(nrow(scores), 0, 0.9)))))
write_data("kruskal_scores_crd", scores)
tied <- kw(kruskal.test(score ~ factor(treatment), data = scores))

tiny <- kw(kruskal.test(c(1, 2, 2, 4, 5, 6), factor(c("a", "a", "a", "b", "b", "b"))))

write_fixture("kruskal_wallis", list(
  r_calls = c("kruskal.test(count ~ factor(spray), data = insect_sprays.csv)  # = datasets::InsectSprays",
              "set.seed(2024); 0-4 scores, n = 5, 7, 4, 6 (kruskal_scores_crd.csv); kruskal.test(score ~ factor(treatment))",
              "kruskal.test(c(1, 2, 2, 4, 5, 6), factor(c('a', 'a', 'a', 'b', 'b', 'b')))"),
  insectSprays = c(list(data = "insect_sprays.csv", options = list(design = "crd", response = "count", treatment = "spray")), insect),
  tiedScores = c(list(data = "kruskal_scores_crd.csv", options = list(design = "crd", response = "score", treatment = "treatment"),
                      distinctValues = length(unique(scores$score))), tied),
  tiny = tiny))
