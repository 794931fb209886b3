// Placeholder until the trade module lands (ISO/IEC 7064 MOD 37-2 tag codes).
const ALPHABET = "23456789ABCDEFGHJKMNPQRTUVWXYZ";
const MOD37 = "0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZ*";

function check(data: string): string {
  let p = 0;
  for (const ch of data) p = ((p + MOD37.indexOf(ch)) * 2) % 37;
  return MOD37[(38 - p) % 37]!;
}

export function normalizeTagCode(input: string): string {
  return input.toUpperCase().replace(/[\s-]/g, "");
}

export function isValidTagCode(input: string): boolean {
  const code = normalizeTagCode(input);
  return /^[0-9A-Z*]{7}$/.test(code) && check(code.slice(0, 6)) === code[6];
}

export function generateTagCode(random: () => number = Math.random): string {
  for (;;) {
    let data = "";
    for (let i = 0; i < 6; i++) data += ALPHABET[Math.floor(random() * ALPHABET.length)];
    const c = check(data);
    if (ALPHABET.includes(c)) return data + c;
  }
}

export function formatTagCode(code: string): string {
  const c = normalizeTagCode(code);
  return `${c.slice(0, 3)}-${c.slice(3)}`;
}
