# Builds the expected analysis document (contract analysis-cli.md shape) from R's
# lm / anova / emmeans / shapiro.test / car::leveneTest / friedman.test.
suppressPackageStartupMessages({ library(emmeans); library(car) })
emm_options(msg.interaction = FALSE, msg.nesting = FALSE)

anova_rows <- function(tab, error_of = list()) {
  rows <- list()
  names_r <- trimws(rownames(tab))
  for (i in seq_len(nrow(tab))) {
    src <- names_r[i]
    if (src == "Residuals") {
      rows[[length(rows) + 1]] <- list(source = "residual", df = tab$Df[i], ss = tab$"Sum Sq"[i], ms = tab$"Mean Sq"[i])
    } else {
      ms <- tab$"Mean Sq"[i]
      if (!is.null(error_of[[src]])) {
        j <- which(names_r == error_of[[src]])
        f <- ms / tab$"Mean Sq"[j]; p <- pf(f, tab$Df[i], tab$Df[j], lower.tail = FALSE)
      } else { f <- tab$"F value"[i]; p <- tab$"Pr(>F)"[i] }
      rows[[length(rows) + 1]] <- list(source = src, df = tab$Df[i], ss = tab$"Sum Sq"[i], ms = ms, f = f, p = p)
    }
  }
  rows
}

# fit: lm; trt: name of the treatment factor; y: analysed response vector used in fit
expected_doc <- function(fit, data, y, trt, sources, back = NULL, error_term = NULL, error_of = list(), friedman = NULL) {
  tab <- anova(fit)
  rownames(tab) <- c(sources, "Residuals")
  emm <- emmeans(fit, as.formula(paste("~", trt)))
  s <- summary(emm)
  ms_res <- tab["Residuals", "Mean Sq"]; df_res <- tab["Residuals", "Df"]
  ms_err <- ms_res; df_err <- df_res
  if (!is.null(error_term)) { ms_err <- tab[error_term, "Mean Sq"]; df_err <- tab[error_term, "Df"] }
  scale <- sqrt(ms_err / ms_res)
  lv <- levels(data[[trt]])
  means <- lapply(seq_along(lv), function(i) {
    m <- list(treatment = lv[i], n = sum(data[[trt]] == lv[i]), mean = mean(y[data[[trt]] == lv[i]]),
              lsmean = s$emmean[i], se = s$SE[i] * scale)
    if (!is.null(back)) m$backTransformed <- back(s$emmean[i])
    m
  })
  pr <- summary(pairs(emm, adjust = "none"))
  k <- length(lv)
  comparisons <- lapply(seq_len(nrow(pr)), function(i) {
    parts <- strsplit(as.character(pr$contrast[i]), " - ", fixed = TRUE)[[1]]
    # emmeans prefixes numeric-looking levels with the factor name ("rate25 - rate50")
    parts <- sapply(parts, function(x) if (x %in% lv) x else sub(paste0("^", trt), "", x), USE.NAMES = FALSE)
    se <- pr$SE[i] * scale; t <- pr$estimate[i] / se
    list(a = parts[1], b = parts[2], diff = pr$estimate[i], se = se,
         pLsd = 2 * pt(abs(t), df_err, lower.tail = FALSE),
         pTukey = ptukey(sqrt(2) * abs(t), k, df_err, lower.tail = FALSE))
  })
  sw <- shapiro.test(residuals(fit))
  lev <- leveneTest(y ~ data[[trt]], center = median)
  doc <- list(n = length(y), grandMean = mean(y), cvPercent = 100 * sqrt(ms_res) / mean(y),
              anova = anova_rows(tab, error_of), means = means, comparisons = comparisons,
              assumptions = list(shapiroWilk = list(w = unname(sw$statistic), p = sw$p.value),
                                 levene = list(f = lev$"F value"[1], p = lev$"Pr(>F)"[1])))
  ses <- sapply(comparisons, function(x) x$se)
  doc$lsd <- if (max(ses) - min(ses) < 1e-9 * max(ses)) qt(1 - 0.05 / 2, df_err) * ses[1] else NULL
  if (!is.null(friedman)) doc$friedman <- friedman
  doc
}
