/** Preloaded into a measured child: prints its own peak resident memory when it exits. */
process.on("exit", () => {
  process.stderr.write(`PHASEWISE_MAXRSS_KB ${process.resourceUsage().maxRSS}\n`);
});
