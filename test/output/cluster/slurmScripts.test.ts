import { describe, expect, it } from 'vitest';
import { shellQuote, slurmBatchScript, slurmMergeScript, slurmTimeLimit } from '../../../src/output/index.js';
import type { SlurmScriptInput } from '../../../src/output/index.js';

// The time formats are those the Slurm sbatch manual lists for --time
// ("minutes:seconds", "hours:minutes:seconds", "days-hours:minutes:seconds");
// POSIX shell single-quoting is from the POSIX Shell Command Language, section 2.2.2.

describe('slurmTimeLimit', () => {
  it('writes hours:minutes:seconds below a day and days-hours:minutes:seconds from a day on (Slurm sbatch manual)', () => {
    expect(slurmTimeLimit(43)).toBe('00:43:00');
    expect(slurmTimeLimit(90)).toBe('01:30:00');
    expect(slurmTimeLimit(1440)).toBe('1-00:00:00');
    expect(slurmTimeLimit(3000)).toBe('2-02:00:00');
    // rounded up to whole minutes: a limit is never shorter than asked
    expect(slurmTimeLimit(0.2)).toBe('00:01:00');
  });
});

describe('shellQuote', () => {
  it('leaves safe words alone and single-quotes the rest (POSIX Shell Command Language 2.2.2)', () => {
    expect(shellQuote('/data/run-1/config.yaml')).toBe('/data/run-1/config.yaml');
    expect(shellQuote('my run')).toBe("'my run'");
    expect(shellQuote("it's")).toBe("'it'\\''s'");
    expect(shellQuote('$HOME')).toBe("'$HOME'");
  });
});

const INPUT: SlurmScriptInput = {
  jobName: 'candela-demo', partCount: 4, cpusPerTask: 2, partMinutes: 90, stopWarningSeconds: 600, stepsPerPart: 5000,
  account: 'lab_1', queue: null, memory: '4G', workingDir: '/home/me/project', launcher: ['npx', 'candela'],
  configPath: '/home/me/project/my run.yaml', outDir: '/scratch/out', logsDir: '/scratch/out/slurm/logs',
  sbatchPath: '/scratch/out/slurm/candela-parts.sbatch', mergePath: '/scratch/out/slurm/merge.sh',
  parts: [0, 1, 2, 3].map((index) => ({ index, label: index < 2 ? 'flat_lcdm' : 'flat_wcdm', ensemble: index % 2, runDir: `/scratch/out/parts/${index < 2 ? 'flat_lcdm' : 'flat_wcdm'}/ensemble-${index % 2}` })),
  merges: ['flat_lcdm', 'flat_wcdm'].map((label) => ({ label, partDirs: [0, 1].map((k) => `/scratch/out/parts/${label}/ensemble-${k}`), runDir: `/scratch/out/${label}` })),
};

describe('slurmBatchScript', () => {
  const lines = slurmBatchScript(INPUT).split('\n');
  it('puts every #SBATCH option before the first command (Slurm sbatch manual, "batch script")', () => {
    const firstCommand = lines.findIndex((line) => line !== '' && !line.startsWith('#'));
    expect(lines.slice(firstCommand).some((line) => line.startsWith('#SBATCH'))).toBe(false);
    expect(lines.filter((line) => line.startsWith('#SBATCH'))).toEqual([
      '#SBATCH --job-name=candela-demo', '#SBATCH --array=0-3', '#SBATCH --ntasks=1', '#SBATCH --cpus-per-task=2', '#SBATCH --time=01:30:00',
      '#SBATCH --signal=B:TERM@600', '#SBATCH --account=lab_1', '#SBATCH --mem=4G', '#SBATCH --output=/scratch/out/slurm/logs/part-%A_%a.log',
    ]);
  });

  it('runs the array task\'s part with exec (so SIGTERM reaches candela), quoting the configuration path', () => {
    expect(lines.at(-2)).toBe(`exec npx candela fit '/home/me/project/my run.yaml' --out /scratch/out --part "$SLURM_ARRAY_TASK_ID" --workers "\${SLURM_CPUS_PER_TASK:-2}" --steps-per-part "$steps" $resume`);
    expect(lines).toContain('if [ -e "${folders[$SLURM_ARRAY_TASK_ID]}/checkpoint.bin" ]; then resume=--resume; fi');
  });
});

describe('slurmMergeScript', () => {
  it('runs one merge per model and exits with the last failure', () => {
    const lines = slurmMergeScript(INPUT).split('\n');
    expect(lines.filter((line) => line.includes(' merge '))).toEqual(['flat_lcdm', 'flat_wcdm'].map((label) =>
      `npx candela merge /scratch/out/parts/${label}/ensemble-0 /scratch/out/parts/${label}/ensemble-1 --out /scratch/out/${label} --force || status=$?`));
    expect(lines.at(-2)).toBe('exit "$status"');
  });
});
