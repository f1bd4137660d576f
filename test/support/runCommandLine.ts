// Test helper (not a test): runs the candela command line in this process and captures what it prints.
import { vi } from 'vitest';
import { main } from '../../src/cli/main.js';

/** Runs `candela <argv>` through the real entry point; stdout and stderr are captured, not shown. */
export async function runCommandLine(argv: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const out = vi.spyOn(process.stdout, 'write').mockImplementation((chunk) => { stdout += String(chunk); return true; });
  const err = vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => { stderr += String(chunk); return true; });
  try {
    const code = await main(argv);
    return { code, stdout, stderr };
  } finally {
    out.mockRestore();
    err.mockRestore();
  }
}
