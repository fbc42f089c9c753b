/**
 * FNV-1a, 64-bit (Fowler, Noll, Vo; parameters as published in the FNV reference and the IETF draft
 * "The FNV Non-Cryptographic Hash Algorithm"): offset basis 0xcbf29ce484222325, prime 2^40 + 0x1b3.
 * Pure and the same in every JavaScript engine, so a diagram gets the same id prefix in Node and in a
 * browser. Linear in the input length. Not for security, only to tell diagrams apart.
 *
 * The 64-bit state is kept as two unsigned 32-bit halves; multiplying by 2^40 + 0x1b3 modulo 2^64 is
 * x * 0x1b3 plus (low half << 8) added to the high half.
 */
export function fnv1a64(bytes: Uint8Array): string {
  let hi = 0xcbf29ce4
  let lo = 0x84222325
  for (let i = 0; i < bytes.length; i++) {
    lo = (lo ^ bytes[i]!) >>> 0
    const low = lo * 0x1b3 // < 2^41: exact in a double
    const carry = Math.floor(low / 0x100000000)
    hi = (Math.imul(hi, 0x1b3) + carry + (lo << 8)) >>> 0
    lo = low >>> 0
  }
  return hi.toString(16).padStart(8, '0') + lo.toString(16).padStart(8, '0')
}

const encoder = new TextEncoder()

/** FNV-1a 64 of the UTF-8 bytes of `text`, as 16 hex digits. */
export function hashText(text: string): string {
  return fnv1a64(encoder.encode(text))
}
