/**
 * What a number field sends. The API is the one validator, so the form does not second-guess:
 * an empty field is left out, a number is sent as a number (thousands separators and a typed
 * minus sign allowed), and anything else is sent as typed so the API names the field.
 */
export function numberOrText(raw: string): number | string | undefined {
  const text = raw.trim();
  if (text === "") return undefined;
  const plain = text.replace(/[\s,\u00a0\u202f]/g, "").replace(/^\u2212/, "-");
  if (/^[-+]?(\d+(\.\d*)?|\.\d+)(e[-+]?\d+)?$/i.test(plain)) {
    const value = Number(plain);
    if (Number.isFinite(value)) return value;
  }
  return text;
}

