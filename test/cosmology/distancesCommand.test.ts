import { afterEach, describe, expect, it } from 'vitest';
import { loadReferenceRows } from './referenceDistances.js';
import { runCommandLine } from '../support/runCommandLine.js';

const run = (args: string[]) => runCommandLine(args);

afterEach(() => { process.exitCode = undefined; });

describe('candela distances', () => {
  it('--json reproduces the astropy 5.2.1 reference rows of Flatw0waCDM(Om0=0.3, w0=-0.9, wa=0.3), no radiation', async () => {
    const { code, stdout } = await run(['distances', '--dark-energy', 'cpl', '--omega-m', '0.3', '--w0', '-0.9', '--wa', '0.3', '--z', '0.5,1,2', '--json']);
    expect(code).toBe(0);
    const table = JSON.parse(stdout);
    // Source: ../shared/reference/distances.csv, case w0waCDM_flat_w0-0.9_wa0.3_norad (astropy 5.2.1).
    const reference = loadReferenceRows().filter((row) => row.case === 'w0waCDM_flat_w0-0.9_wa0.3_norad');
    expect(table.rows.map((row: { z: number }) => row.z)).toEqual([0.5, 1, 2]);
    for (const row of table.rows) {
      const expected = reference.find((r) => r.z === row.z)!;
      // Relative 1e-9 (reference good to ~1e-12 for distances, ~1e-10 for ages, README); distmod absolute 1e-8 mag.
      expect(row.expansion_rate).toBeCloseTo(expected.E_z, 8);
      expect(Math.abs(row.comoving_distance_mpc / expected.comoving_distance_Mpc - 1)).toBeLessThan(1e-9);
      expect(Math.abs(row.transverse_comoving_distance_mpc / expected.transverse_comoving_distance_Mpc - 1)).toBeLessThan(1e-9);
      expect(Math.abs(row.luminosity_distance_mpc / expected.luminosity_distance_Mpc - 1)).toBeLessThan(1e-9);
      expect(Math.abs(row.angular_diameter_distance_mpc / expected.angular_diameter_distance_Mpc - 1)).toBeLessThan(1e-9);
      expect(Math.abs(row.distance_modulus_mag - expected.distmod_mag)).toBeLessThan(1e-8);
      expect(Math.abs(row.lookback_time_gyr / expected.lookback_time_Gyr - 1)).toBeLessThan(1e-9);
      expect(Math.abs(row.age_gyr / expected.age_Gyr - 1)).toBeLessThan(1e-9);
    }
    expect(Math.abs(table.today.age_gyr / reference[0].age_today_Gyr - 1)).toBeLessThan(1e-9);
    expect(table.model).toMatchObject({ dark_energy: 'cpl', flat: true, omega_m: 0.3, w0: -0.9, wa: 0.3, omega_k: 0, omega_r: 0 });
  });

  it('prints a text table by default and CSV with --csv, one line per redshift', async () => {
    const text = await run(['distances', '--z', '0.5,1']);
    expect(text.code).toBe(0);
    expect(text.stdout).toContain('Flat universe, dark energy: cosmological constant, no radiation');
    expect(text.stdout.trim().split('\n')).toHaveLength(4 + 1 + 2);
    const csv = await run(['distances', '--z', '1', '--csv', '--radiation']);
    const [header, line] = csv.stdout.trim().split('\n');
    expect(header).toBe('z,H_over_H0,D_C_Mpc,D_M_Mpc,D_L_Mpc,D_A_Mpc,mu_mag,t_lookback_Gyr,t_age_Gyr,q');
    // Source: distances.csv, LCDM_flat_Om0.3_rad at z = 1: D_L = 6604.9... Mpc (radiation on, T_CMB = 2.7255 K).
    const expected = loadReferenceRows().find((r) => r.case === 'LCDM_flat_Om0.3_rad' && r.z === 1)!;
    expect(Math.abs(Number(line.split(',')[4]) / expected.luminosity_distance_Mpc - 1)).toBeLessThan(1e-9);
  });

  it('exits 2 and names the option and the fix for bad input', async () => {
    const cases: [string[], string][] = [
      [['distances', '--z', '0.5,abc'], '--z'],
      [['distances', '--dark-energy', 'phantom', '--z', '1'], '--dark-energy'],
      [['distances', '--curved', '--z', '1'], '--omega-de'],
      [['distances', '--omega-m', '-1', '--z', '1'], '--omega-m'],
      [['distances', '--w0', '-0.9', '--z', '1'], '--dark-energy'],
      // A flat model derives Omega_DE: --omega-de without --curved was silently ignored before.
      [['distances', '--omega-de', '0.8', '--z', '1'], '--omega-de'],
      [['distances'], '--z'],
      [['distances', '--z-file', 'no/such/file.txt'], '--z-file'],
    ];
    for (const [args, flag] of cases) {
      const { code, stderr, stdout } = await run(args);
      expect(code, args.join(' ')).toBe(2);
      expect(stdout).toBe('');
      expect(stderr).toContain(flag);
      expect(stderr).toContain('fix:');
    }
  });

  it('reports a bouncing closed model (Omega_m = 0.1, Omega_DE = 2.5) as unphysical with exit 2', async () => {
    const { code, stderr } = await run(['distances', '--curved', '--omega-m', '0.1', '--omega-de', '2.5', '--z', '0.5']);
    expect(code).toBe(2);
    expect(stderr).toMatch(/no Big Bang/);
  });

  it('--help shows an example', async () => {
    const { code, stdout } = await run(['distances', '--help']);
    expect(code).toBe(0);
    expect(stdout).toContain('candela distances --dark-energy cpl');
  });
});
