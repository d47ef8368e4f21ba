import { randomInt } from 'node:crypto'

/** Crockford's base-32 alphabet: no I, L, O or U, so a code read aloud or typed is not misread. */
const ALPHABET = '0123456789ABCDEFGHJKMNPQRSTVWXYZ'
/** 8 characters of base 32 = 40 bits: collisions are negligible for a workshop's labels. */
const LABEL_CODE_LENGTH = 8

/** A new label code for a QR label: "B" for bins and "P" for parts, then random characters. */
export function newLabelCode(prefix: 'B' | 'P'): string {
  let code = prefix
  for (let i = 0; i < LABEL_CODE_LENGTH; i++) code += ALPHABET[randomInt(ALPHABET.length)]
  return code
}
