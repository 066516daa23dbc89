/**
 * Numbers as the working steps print them: at most four decimals, trailing zeros dropped, a true
 * minus sign. Four decimals let a reader redo a step by hand to the precision published values
 * are quoted at.
 *
 * @example
 * formatNumber(-0.71412); // '−0.7141'
 * formatNumber(0.5); // '0.5'
 * formatNumber(1.38629, 2); // '1.39'
 */
export function formatNumber(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  let text = value.toFixed(digits);
  if (text.includes('.')) text = text.replace(/0+$/, '').replace(/\.$/, '');
  if (text === '-0') text = '0';
  return text.startsWith('-') ? `−${text.slice(1)}` : text;
}

/**
 * A number with its sign always written, for terms that are added up.
 *
 * @example
 * formatSigned(2.426); // '+2.426'
 * formatSigned(-1); // '−1'
 */
export function formatSigned(value: number, digits = 4): string {
  const text = formatNumber(value, digits);
  return text.startsWith('−') || text === '0' ? text : `+${text}`;
}

/**
 * A probability as a percentage with one decimal, for sentences.
 *
 * @example
 * formatPercent(0.4567); // '45.7 %'
 */
export function formatPercent(value: number): string {
  return `${formatNumber(value * 100, 1)} %`;
}
