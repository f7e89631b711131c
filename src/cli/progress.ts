import cliProgress from 'cli-progress';

export interface Progress {
  update(rows: number): void;
  stop(): void;
}

/**
 * Load progress on stderr: a bar with rows, rows/s and ETA on a terminal (the total is an estimate
 * from the file size), plain lines at most every two seconds otherwise (logs, pipes, CI).
 */
export function createProgress(estimatedRows: number | undefined): Progress {
  const start = Date.now();
  if (process.stderr.isTTY) {
    const total = Math.max(estimatedRows ?? 0, 1);
    const bar = new cliProgress.SingleBar(
      {
        format: 'loading [{bar}] {value} rows | {rate} rows/s | ETA {eta_formatted}',
        stream: process.stderr,
        etaBuffer: 20,
      },
      cliProgress.Presets.shades_classic,
    );
    bar.start(total, 0, { rate: 0 });
    let stopped = false;
    return {
      update(rows) {
        if (rows > bar.getTotal()) bar.setTotal(rows);
        bar.update(rows, { rate: Math.round(rows / Math.max((Date.now() - start) / 1000, 1e-3)) });
      },
      stop() {
        if (!stopped) bar.stop();
        stopped = true;
      },
    };
  }
  let last = 0;
  return {
    update(rows) {
      const now = Date.now();
      if (now - last < 2000) return;
      last = now;
      const rate = Math.round(rows / Math.max((now - start) / 1000, 1e-3));
      process.stderr.write(`loading: ${rows} rows read, ${rate} rows/s\n`);
    },
    stop() {},
  };
}
