/**
 * A postal address typed in a text box, one line per item, as the list the API stores: lines
 * trimmed, blank lines dropped. Never throws; an empty text gives [].
 * @example addressLines(' 4 Quay Road \n\nPortsmouth PO1 3AB\n'); // ['4 Quay Road', 'Portsmouth PO1 3AB']
 */
export function addressLines(text: string): string[] {
  return text
    .split(/\r?\n/)
    .map((line) => line.trim())
    .filter((line) => line.length > 0);
}
