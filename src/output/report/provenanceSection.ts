import { escapeXml } from '../figures/index.js';
import { htmlElement } from './htmlElement.js';
import type { ReportInputFile } from './reportInput.js';

/**
 * The provenance sections: the resolved configuration as escaped YAML in a
 * `<pre>` block, and a table of input files (the path as written and, when it
 * differs, as resolved; role; size) with their SHA-256 digest, so
 * a reader can check that a rerun used the same inputs.
 *
 * @param configurationYaml the configuration after defaults, as YAML text
 * @param inputFiles input files with their digests (hex) and sizes (bytes)
 * @returns `<section id="configuration">` and `<section id="inputs">` elements
 * @example provenanceSection('seed: 7\n', [{ path: 'data/sn.csv', sha256: 'ab12...', sizeBytes: 1024 }])
 */
export function provenanceSection(configurationYaml: string, inputFiles: readonly ReportInputFile[]): string {
  const configuration = htmlElement('section', { id: 'configuration' }, [
    htmlElement('h2', {}, 'Resolved configuration'),
    '\n',
    htmlElement('pre', {}, htmlElement('code', { class: 'language-yaml' }, escapeXml(configurationYaml.replace(/\s+$/, '')))),
    '\n',
  ]);
  const head = htmlElement('thead', {}, htmlElement('tr', {}, ['file', 'role', 'size (bytes)', 'SHA-256'].map((text) => htmlElement('th', { scope: 'col' }, text))));
  const rows = inputFiles.map((file) => htmlElement('tr', {}, [
    htmlElement('td', {}, file.resolvedPath && file.resolvedPath !== file.path
      ? [htmlElement('code', {}, escapeXml(file.path)), htmlElement('span', { class: 'resolved' }, [' → ', htmlElement('code', {}, escapeXml(file.resolvedPath))])]
      : htmlElement('code', {}, escapeXml(file.path))),
    htmlElement('td', {}, escapeXml(file.role ?? '')),
    htmlElement('td', { class: 'number' }, file.sizeBytes === undefined ? '' : String(file.sizeBytes)),
    htmlElement('td', { class: 'digest' }, escapeXml(file.sha256)),
  ]));
  const inputs = htmlElement('section', { id: 'inputs' }, [
    htmlElement('h2', {}, 'Input files'),
    '\n',
    inputFiles.length ? htmlElement('table', {}, [head, '\n', htmlElement('tbody', {}, rows.join('\n'))]) : htmlElement('p', { class: 'note' }, 'No input files were recorded.'),
    '\n',
  ]);
  return `${configuration}\n${inputs}`;
}
