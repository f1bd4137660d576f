/**
 * Columns a string takes in a terminal, counting code points and skipping
 * combining marks (U+0300-U+036F, e.g. the bar of 'x̄'). The symbols candela
 * prints (Greek letters, superscripts, ±, box drawing) are one column wide.
 * Private to the output layer.
 * @example displayWidth('x̄1') // 2
 */
export function displayWidth(text: string): number {
  let width = 0;
  for (const character of text) {
    const code = character.codePointAt(0) as number;
    if (code < 0x300 || code > 0x36f) width++;
  }
  return width;
}

/** Pads (or cuts, with an ellipsis) a string to a display width; right-aligns when asked. */
export function fitWidth(text: string, width: number, alignRight = false): string {
  let fitted = text;
  if (displayWidth(fitted) > width) {
    const characters = [...fitted];
    while (characters.length && displayWidth(characters.join('')) > width - 1) characters.pop();
    fitted = `${characters.join('')}…`;
  }
  const padding = ' '.repeat(Math.max(0, width - displayWidth(fitted)));
  return alignRight ? padding + fitted : fitted + padding;
}
