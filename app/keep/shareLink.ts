import { readDesignFile, writeDesignFile, type DesignDocument, type ReadResult } from './designFile';

/**
 * A design carried in a URL fragment (#design=…): the design file's JSON,
 * UTF-8, in base64url. The fragment never reaches a server. Opening a link
 * validates it exactly as opening a file does.
 */
const KEY = 'design';

function toBase64Url(bytes: Uint8Array): string {
  let bin = '';
  for (const b of bytes) bin += String.fromCharCode(b);
  return btoa(bin).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
}

function fromBase64Url(text: string): Uint8Array | null {
  try {
    const bin = atob(text.replace(/-/g, '+').replace(/_/g, '/'));
    return Uint8Array.from(bin, (c) => c.charCodeAt(0));
  } catch {
    return null;
  }
}

export function shareFragment(doc: DesignDocument): string {
  return `#${KEY}=${toBase64Url(new TextEncoder().encode(writeDesignFile(doc)))}`;
}

/**
 * Longest design link accepted, in characters after "#design=". A design is a
 * few kilobytes; a longer link is refused by its length before any decoding,
 * so a pasted megabyte costs nothing.
 */
export const MAX_LINK_CHARS = 100_000;

const KEPT = 'The bench kept your last design.';

/**
 * The design in a location hash: null when the hash carries none, else the
 * design or a failure whose message says what is wrong with the link.
 */
export function readShareFragment(hash: string): ReadResult | null {
  const prefix = /^#?design=/.exec(hash);
  if (!prefix) return null;
  const body = hash.slice(prefix[0].length);
  if (body.length > MAX_LINK_CHARS) {
    return { ok: false, message: `The shared link is ${body.length.toLocaleString('en')} characters long; a design link is at most ${MAX_LINK_CHARS.toLocaleString('en')}. ${KEPT}` };
  }
  const stray = /[^A-Za-z0-9_-]/.exec(body);
  if (stray) {
    const what = stray[0] === '=' ? 'padding “=”, which design links never carry' : `the character “${stray[0]}”, which is not base64url`;
    return { ok: false, message: `The shared link is damaged: at place ${stray.index + 1} it has ${what}. ${KEPT}` };
  }
  const bytes = fromBase64Url(body);
  if (!bytes) return { ok: false, message: `The shared link is damaged (not valid base64url). ${KEPT}` };
  const r = readDesignFile(new TextDecoder().decode(bytes), bytes.length);
  return r.ok ? r : { ok: false, message: `The shared link could not be opened: ${r.message.replace(/ Nothing was opened\.$/, '')}. ${KEPT}` };
}
