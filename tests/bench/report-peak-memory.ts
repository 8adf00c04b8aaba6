/*
 * Loaded with --import before the command line in the benchmark: reports the process's peak
 * resident memory on stderr as it exits, without touching the command line itself.
 */
process.on('exit', () => {
  process.stderr.write(`peak-rss-kb ${process.resourceUsage().maxRSS}\n`)
})
