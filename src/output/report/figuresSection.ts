import { escapeXml } from '../figures/index.js';
import { htmlElement } from './htmlElement.js';
import { namespaceSvgIds } from './namespaceSvgIds.js';
import type { ReportFigure } from './reportInput.js';

/**
 * The "Figures" section: each SVG inlined (no external file, no script) in
 * a `<figure>` with its title, caption and file name; ids are prefixed per
 * figure (`fig1-`, `fig2-`, ...) so that clip paths stay unique on the page.
 *
 * @param figures figures in display order
 * @returns a `<section id="figures">` element, or '' when there is none
 * @example figuresSection([{ title: 'Posterior', svg: triangleFigure(runs, ['omega_m', 'w0']) }])
 */
export function figuresSection(figures: readonly ReportFigure[]): string {
  if (figures.length === 0) return '';
  const items = figures.map((figure, index) => {
    // An XML declaration or doctype may not appear inside an HTML body.
    const svg = namespaceSvgIds(figure.svg.replace(/<\?xml[^>]*\?>|<!DOCTYPE[^>]*>/gi, '').trim(), `fig${index + 1}-`);
    const caption = [htmlElement('strong', {}, escapeXml(figure.title))];
    if (figure.caption) caption.push(` ${escapeXml(figure.caption)}`);
    if (figure.fileName) caption.push(` (file ${htmlElement('code', {}, escapeXml(figure.fileName))})`);
    return htmlElement('figure', { id: `figure-${index + 1}` }, ['\n', svg, '\n', htmlElement('figcaption', {}, caption), '\n']);
  });
  return htmlElement('section', { id: 'figures' }, [htmlElement('h2', {}, 'Figures'), '\n', items.join('\n'), '\n']);
}
