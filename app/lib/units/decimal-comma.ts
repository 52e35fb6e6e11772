// Decimal commas, for people whose keyboards and habits write 1,5 for one and a half.
// The rule (also in docs/user-guide.md, "Typing numbers"):
//   - a single comma is a decimal comma ("1,5" → 1.5, "0,125" → 0.125), unless it splits off
//     exactly three digits after a first group of 1–3 digits that does not start with 0:
//     "1,250" stays one thousand two hundred and fifty, as it is read in the shop's drawings;
//   - with both points and commas, the last of them is the decimal mark ("1.250,5" → 1250.5;
//     "1,250.5" stays 1250.5);
//   - in a list (torque stages) commas separate the items; write decimal commas there only when
//     the items are separated by semicolons ("54,2; 108,5; 156").
// The text after the number (a unit) is left as it is.

const NUMBER_HEAD = /^(\s*[-+]?)([0-9][0-9.,]*)(.*)$/s;

/** The typed text with its decimal comma (if any) written as a point, ready for parseQuantity. */
export function decimalPoint(text: string): string {
  const m = NUMBER_HEAD.exec(text);
  if (!m) return text;
  const [, sign, num, rest] = m as unknown as [string, string, string, string];
  return sign + normalizeNumber(num) + rest;
}

function normalizeNumber(num: string): string {
  const commas = (num.match(/,/g) ?? []).length;
  const points = (num.match(/\./g) ?? []).length;
  if (commas === 0) return num;
  if (points === 0) {
    // "1,250" and "1,250,000": thousands grouping, left for the reader of groups
    if (/^[1-9]\d{0,2}(,\d{3})+$/.test(num)) return num;
    // one comma between digits: a decimal comma
    if (commas === 1 && /^\d+,\d+$/.test(num)) return num.replace(",", ".");
    return num;
  }
  const lastComma = num.lastIndexOf(",");
  const lastPoint = num.lastIndexOf(".");
  // "1.250,5": points group the thousands, the comma is the decimal mark
  if (lastComma > lastPoint && commas === 1 && /^[1-9]\d{0,2}(\.\d{3})+,\d+$/.test(num)) return num.replace(/\./g, "").replace(",", ".");
  return num;
}

/** Split a typed list into items: on semicolons when there are any (commas are then decimal), else on commas. */
export function splitList(text: string): string[] {
  const parts = text.includes(";") ? text.split(/[;/]+/) : text.split(/[,;/]+/);
  return parts.map((p) => p.trim()).filter((p) => p !== "");
}
