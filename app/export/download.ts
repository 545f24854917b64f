/** Hands a blob to the browser as a download with the given file name. */
export function download(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

const MAX_STEM = 60;

/** A file name from a design title: letters, digits and dashes only, whole words. */
export function fileStem(title: string): string {
  const whole = title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '');
  // At most 60 characters, cut between words (a long amplifier's title had ended in "phase-splitte").
  const lastBreak = whole.slice(0, MAX_STEM + 1).lastIndexOf('-');
  const cut = whole.length <= MAX_STEM ? whole : whole.slice(0, lastBreak > 0 ? lastBreak : MAX_STEM);
  return cut || 'quiescent-design';
}
