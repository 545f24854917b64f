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

/** The design in a location hash, null when the hash carries none, or a failure with its message. */
export function readShareFragment(hash: string): ReadResult | null {
  const m = /^#?design=([A-Za-z0-9_-]*)$/.exec(hash);
  if (!m) return null;
  const bytes = fromBase64Url(m[1]!);
  if (!bytes) return { ok: false, message: 'The shared link is damaged (not valid base64). The bench opened on its last design instead.' };
  const r = readDesignFile(new TextDecoder().decode(bytes), bytes.length);
  return r.ok ? r : { ok: false, message: `The shared link could not be opened: ${r.message}` };
}
