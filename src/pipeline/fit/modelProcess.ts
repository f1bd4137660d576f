import { spawn, type ChildProcess } from 'node:child_process';

/** How a model's process ended. */
export interface ModelProcessEnd {
  /** Its exit code, or null when a signal ended it. */
  code: number | null;
  /** The signal that ended it, or null. */
  signal: NodeJS.Signals | null;
  /** Everything it wrote on its standard output (the run report). */
  stdout: string;
}

/** A running `candela fit CONFIG --model LABEL` process. */
export interface ModelProcess {
  /** Sends `signal` to the process (nothing when it has ended). */
  send(signal: NodeJS.Signals): void;
  /** Settles when the process has ended and its output is read. */
  ended: Promise<ModelProcessEnd>;
}

/**
 * Starts one model's fit as a process of its own: `launcher` (the node binary
 * and candela's entry script) followed by `args`. The process gets a process
 * group of its own (detached), so that a Ctrl-C at the terminal reaches only
 * the conductor, which passes it on exactly once (a model that got the
 * terminal's signal and the conductor's would take the second one as "leave
 * at once" and write nothing). Its standard error is handed over line by
 * line as it comes (`onLine`, without the line end; empty lines skipped);
 * its standard output is kept and returned when it ends.
 * @param launcher the words that start candela (node, entry script).
 * @param args the command's arguments (fit CONFIG --model LABEL ...).
 * @param onLine called with each line the process writes on standard error.
 * @returns the running process.
 * @throws nothing (a process that cannot start ends with code null and the reason as a line).
 * @example startModelProcess([process.execPath, 'dist/src/cli/main.js'], ['fit', 'c.yaml', '--model', 'flat_lcdm'], console.error)
 */
export function startModelProcess(launcher: readonly string[], args: readonly string[], onLine: (line: string) => void): ModelProcess {
  const child: ChildProcess = spawn(launcher[0], [...launcher.slice(1), ...args], { detached: true, stdio: ['ignore', 'pipe', 'pipe'] });
  let stdout = '';
  let pending = '';
  let exited = false;
  child.stdout?.setEncoding('utf8').on('data', (chunk: string) => { stdout += chunk; });
  child.stderr?.setEncoding('utf8').on('data', (chunk: string) => {
    pending += chunk;
    const lines = pending.split('\n');
    pending = lines.pop() ?? '';
    for (const line of lines) if (line.trim() !== '') onLine(line);
  });
  const ended = new Promise<ModelProcessEnd>((resolve) => {
    child.on('error', (error) => {
      onLine(`could not start the model's process: ${error.message}`);
      exited = true;
      resolve({ code: null, signal: null, stdout });
    });
    // 'close' comes after 'exit' once the output streams are drained, so nothing the process wrote is lost.
    child.on('exit', () => { exited = true; });
    child.on('close', (code, signal) => {
      exited = true;
      if (pending.trim() !== '') onLine(pending);
      pending = '';
      resolve({ code, signal, stdout });
    });
  });
  return {
    send(signal) {
      if (exited || child.pid === undefined) return;
      try { child.kill(signal); } catch { /* it ended meanwhile */ }
    },
    ended,
  };
}
