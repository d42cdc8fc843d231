import { createServer } from 'node:net';
import { describe, expect, it } from 'vitest';
import { cpuSeconds, memory, pidListeningOn } from './proc-stats';

describe('proc-stats', () => {
  it('finds the process listening on a port, and reads its CPU time and memory', async () => {
    const server = createServer();
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    try {
      const port = (server.address() as { port: number }).port;
      expect(pidListeningOn(port, process.pid)).toBe(process.pid);
      expect(cpuSeconds(process.pid)).toBeGreaterThan(0);
      const m = memory(process.pid);
      expect(m.rssMiB).toBeGreaterThan(0);
      expect(m.peakRssMiB).toBeGreaterThanOrEqual(m.rssMiB);
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  });
});
