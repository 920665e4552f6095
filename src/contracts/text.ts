// Checks every stored string shares: PostgreSQL refuses U+0000 in text and jsonb and a lone surrogate
// in jsonb, and no other control character belongs in a name, so the contract refuses them with the field
// named instead of letting the database answer a 500.

// C0 controls and DEL; `multiLine` keeps tab, line feed and carriage return for notes.
const CONTROL = /[\u0000-\u001f\u007f]/;
const CONTROL_EXCEPT_WHITESPACE = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;

/** Whether `text` is free of control characters (tab, LF and CR allowed when `multiLine`) and of lone surrogates. */
export function isStorableText(text: string, multiLine = false): boolean {
  return !(multiLine ? CONTROL_EXCEPT_WHITESPACE : CONTROL).test(text) && text.isWellFormed();
}

export function storableTextMessage(field: string, multiLine = false): string {
  return multiLine
    ? `${field} must not contain control characters other than tab and line breaks`
    : `${field} must not contain control characters or line breaks`;
}

/** Largest value of a PostgreSQL `integer` column. */
export const PG_INTEGER_MAX = 2_147_483_647;
