// Waiting on a child started with startChild without blocking the event loop (the server's output keeps being
// relayed meanwhile, so its pipe never fills), and keeping the child's stdout lines for the summary.

/** Resolves with the exit code (a signal counts as 1) and the stdout lines once the child has closed its output. */
export function finishedChild(child) {
  const lines = [];
  let partial = '';
  child.stdout.on('data', (chunk) => {
    const parts = (partial + String(chunk)).split('\n');
    partial = parts.pop() ?? '';
    lines.push(...parts);
  });
  return new Promise((resolve) => {
    child.on('close', (code, signal) => {
      if (partial) lines.push(partial);
      resolve({ code: code ?? (signal ? 1 : 0), lines });
    });
  });
}
