# Simulates an invented roster of athletes' strength tests and fits the response model's
# variances with metafor, as reference values for tests/test_response.c. Usage, from this
# folder:  Rscript make_roster.R 20270314 roster .
# The data are invented (a simulation), never evidence.
#
# Model (src/core/response.h): the observed change of a lift, obs = ln(post/pre 1RM), is
#   obs = yhat + a_athlete + b_block + e,  e ~ N(0, v)
# with yhat the curve of profiles/strength.ini at the lift's dose, the block's length (held
# inside the profile's 4-24 weeks) and the athlete's status, and v the test-error variance of
# the change: 2 t^2 with t = 0.03, plus, when pre and post come from different rep counts, the
# variance over the seven 1RM equations of ln(e1RM/load) at each test's reps.
# The curve's prediction is an offset: the fit is rma.mv on obs - yhat with an intercept,
# athletes as the outer and blocks as the inner random level, REML.
suppressMessages(library(metafor))
args <- commandArgs(TRUE); seed <- as.integer(args[1]); tag <- args[2]; outdir <- args[3]
set.seed(seed)

# profiles/strength.ini: terms intercept, dose, weeks, weeks:dose, trained, trained:dose
beta <- c(0.25, -0.20, 0.01, -0.01, -0.125, 0.075)
V <- matrix(0, 6, 6)
V[1:2, 1:2] <- matrix(c(0.000144, -0.000144, -0.000144, 0.0004), 2)
V[3:4, 3:4] <- matrix(c(0.000004, -0.0000024, -0.0000024, 0.000004), 2)
V[5:6, 5:6] <- matrix(c(0.000144, -0.000144, -0.000144, 0.0004), 2)
design <- function(x, weeks, trained) {
  f <- 1 / (x + 1); w <- min(max(weeks, 4), 24) - 10
  c(1, f, w, w * f, trained, trained * f)
}
# The seven 1RM equations of src/core/e1rm.c, as e1RM / load at r reps.
eq <- function(r) c(1 + r / 30, 36 / (37 - r), 100 / (101.3 - 2.67123 * r), r^0.10,
                    100 / (52.2 + 41.9 * exp(-0.055 * r)), 1 + 0.025 * r,
                    100 / (48.8 + 53.8 * exp(-0.075 * r)))
eqvar <- function(r) if (r <= 1) 0 else var(log(eq(r)))
tsd <- 0.03
changevar <- function(rp, rq) 2 * tsd^2 + if (rp != rq) eqvar(rp) + eqvar(rq) else 0

lifts <- c("back squat", "bench press", "deadlift", "overhead press")
nath <- 24; rows <- list(); k <- 0; bid <- 0
for (a in 1:nath) {
  trained <- rbinom(1, 1, 0.5); ua <- rnorm(1, 0, sqrt(0.004))
  for (b in 1:sample(1:4, 1)) {
    bid <- bid + 1; weeks <- sample(c(4:16, 30), 1); ub <- rnorm(1, 0, sqrt(0.002))
    for (l in sample(lifts, sample(1:3, 1))) {
      k <- k + 1
      x <- sample(seq(0, 30, by = 0.5), 1)
      rp <- sample(c(1, 1, 3, 5), 1); rq <- if (runif(1) < 0.7) rp else sample(c(1, 3, 5, 8), 1)
      z <- design(x, weeks, trained); v <- changevar(rp, rq)
      obs <- sum(z * beta) + ua + ub + rnorm(1, 0, sqrt(v))
      rows[[k]] <- data.frame(athlete = a, block = bid, lift = l, dose = x, weeks = weeks,
                              trained = trained, reps_pre = rp, reps_post = rq,
                              obs = round(obs, 8))
    }
  }
}
d <- do.call(rbind, rows)
write.csv(d, file.path(outdir, paste0(tag, "_tests.csv")), row.names = FALSE, quote = FALSE)

Z <- t(mapply(design, d$dose, d$weeks, d$trained))
d$yhat <- as.vector(Z %*% beta)
d$v <- mapply(changevar, d$reps_pre, d$reps_post)
d$r <- d$obs - d$yhat
m <- rma.mv(r, v, random = ~ 1 | athlete/block, data = d, method = "REML")
res <- list(n = nrow(d), athletes = length(unique(d$athlete)),
            repeated = sum(tapply(d$block, d$athlete, function(b) length(unique(b))) >= 2),
            mean_dev = m$b[1], mean_dev_se = m$se[1], var_athlete = m$sigma2[1],
            var_block = m$sigma2[2], logLik_REML = as.numeric(logLik(m)),
            eqvar_3 = eqvar(3), eqvar_5 = eqvar(5), eqvar_8 = eqvar(8))

# The personal posterior of athletes 1-3 at these variances, by the full-covariance form
# E[a | d] = A 1' S^-1 d, Var = A - A^2 1' S^-1 1 with S = Z V Z' + A 11' + B (same block) + v.
A <- m$sigma2[1]; B <- m$sigma2[2]
for (a in 1:3) {
  i <- which(d$athlete == a); Za <- Z[i, , drop = FALSE]
  S <- Za %*% V %*% t(Za) + A + B * outer(d$block[i], d$block[i], "==") + diag(d$v[i], length(i))
  one <- rep(1, length(i)); Si1 <- solve(S, one)
  res[[sprintf("athlete%d_n", a)]] <- length(i)
  res[[sprintf("athlete%d_mean", a)]] <- A * sum(Si1 * d$r[i])
  res[[sprintf("athlete%d_sd", a)]] <- sqrt(A - A^2 * sum(Si1))
}
con <- file(file.path(outdir, paste0(tag, "_fits.txt")), "w")
writeLines(sprintf("# metafor %s, %s; Rscript make_roster.R %d %s .", packageVersion("metafor"),
                   R.version.string, seed, tag), con)
for (n in names(res)) writeLines(sprintf("%s = %.12g", n, res[[n]]), con)
close(con)
