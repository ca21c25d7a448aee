# The data.table side of scripts/bench-load.
#   Rscript load_fread.R load FILE THREADS REPS WARMUP  -> "median_s=... rows=... threads=..."
#   Rscript load_fread.R describe FILE THREADS          -> "rows N", "mean COLUMN VALUE" lines, then
#                                                          summary() (min, quartiles, median, mean, max) and SD per column
# A .gz file is read from a zcat pipe (fread(cmd = ...)), as the pandas side does.
args <- commandArgs(trailingOnly = TRUE)
suppressPackageStartupMessages(library(data.table))
path <- args[2]
setDTthreads(as.integer(args[3]))
read <- function() if (grepl("\\.gz$", path)) fread(cmd = paste("zcat", shQuote(path))) else fread(path)
if (args[1] == "load") {
  reps <- as.integer(args[4]); warm <- as.integer(args[5])
  t <- numeric(0)
  for (i in seq_len(warm + reps)) {
    t0 <- as.numeric(Sys.time()); d <- read(); el <- as.numeric(Sys.time()) - t0
    if (i > warm) t <- c(t, el)
  }
  cat(sprintf("median_s=%.4f rows=%d threads=%d\n", median(t), nrow(d), getDTthreads()))
} else {
  d <- read()
  cat(sprintf("rows %d\n", nrow(d)))
  for (col in names(d)) cat(sprintf("mean %s %.17g\n", col, mean(d[[col]])))
  print(summary(d))
  print(sapply(d, sd))
}
