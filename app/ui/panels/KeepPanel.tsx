import { useId, useRef, useState } from 'react';
import { readDesignFile, writeDesignFile, MAX_DESIGN_FILE_BYTES } from '../../keep/designFile';
import { openDocument, withNote } from '../../keep/openDocument';
import { shareFragment } from '../../keep/shareLink';
import { putOnShelf, removeFromShelf, shelfNames, takeFromShelf } from '../../keep/storage';
import { download, fileStem } from '../../export/download';
import { useWorkbench, useWorkbenchStore } from '../../store/StoreProvider';

/** Keep designs: undo and redo, files, a share link, and named designs kept in this browser. */
export function KeepPanel() {
  const store = useWorkbenchStore();
  const canUndo = useWorkbench((s) => s.past.length > 0);
  const canRedo = useWorkbench((s) => s.future.length > 0);
  const undo = useWorkbench((s) => s.undo);
  const redo = useWorkbench((s) => s.redo);
  const note = useWorkbench((s) => s.keepNote);
  const setNote = useWorkbench((s) => s.setKeepNote);
  const [names, setNames] = useState(() => shelfNames());
  const [name, setName] = useState('');
  const [link, setLink] = useState('');
  const fileInput = useRef<HTMLInputElement>(null);
  const id = useId();
  const doc = () => ({ title: store.getState().title, design: store.getState().design });

  const open = (text: string, bytes: number, what: string) => {
    const r = readDesignFile(text, bytes);
    if (!r.ok) return setNote({ kind: 'error', text: r.message });
    const opened = openDocument(store, r.doc);
    setNote(opened.failure ? { kind: 'error', text: `${what} could not run: ${opened.failure.message}` } : { kind: opened.note ? 'error' : 'ok', text: withNote(`Opened “${r.doc.title}”.`, opened.note) });
  };

  const onFile = async (file: File | undefined) => {
    if (!file) return;
    // Refuse an oversized file before reading it into memory.
    if (file.size > MAX_DESIGN_FILE_BYTES) return setNote({ kind: 'error', text: `The file is ${(file.size / 1e6).toFixed(1)} MB; a design file is at most 1 MB. Nothing was opened.` });
    open(await readText(file), file.size, 'The file');
    if (fileInput.current) fileInput.current.value = '';
  };

  return (
    <section className="panel keep" aria-labelledby={`${id}-h`}>
      <h2 id={`${id}-h`}>Keep</h2>
      <div className="option-row">
        <button type="button" onClick={undo} disabled={!canUndo} title="Ctrl+Z">Undo</button>
        <button type="button" onClick={redo} disabled={!canRedo} title="Ctrl+Shift+Z">Redo</button>
        <button type="button" onClick={() => download(new Blob([writeDesignFile(doc())], { type: 'application/json' }), `${fileStem(doc().title)}.quiescent.json`)}>Save file</button>
        <label className="file-button">
          Open file
          <input ref={fileInput} type="file" accept=".json,application/json" onChange={(e) => void onFile(e.target.files?.[0])} />
        </label>
        <button type="button" onClick={() => {
          const url = `${location.origin}${location.pathname}${shareFragment(doc())}`;
          setLink(url);
          void navigator.clipboard?.writeText(url).then(() => setNote({ kind: 'ok', text: 'Share link copied.' }), () => setNote({ kind: 'ok', text: 'Share link below: copy it from the box.' }));
        }}>Share link</button>
      </div>
      {link ? <input className="share-link" readOnly value={link} aria-label="Share link for this design" onFocus={(e) => e.target.select()} /> : null}
      <div className="option-row">
        <label htmlFor={`${id}-name`} className="visually-hidden">Name to keep this design under</label>
        <input id={`${id}-name`} value={name} placeholder="Name to keep it under" maxLength={60} onChange={(e) => setName(e.target.value)} />
        <button type="button" disabled={name.trim() === ''} onClick={() => {
          // Kept only if it reads back: a store that says yes and keeps nothing is caught here.
          const ok = putOnShelf(name.trim(), doc()) && takeFromShelf(name.trim()) !== null;
          setNames(shelfNames());
          setNote(ok ? { kind: 'ok', text: `Kept as “${name.trim()}” in this browser.` } : { kind: 'error', text: 'This browser would not store the design (storage full or blocked).' });
        }}>Keep in this browser</button>
      </div>
      {names.length > 0 ? (
        <ul className="shelf">
          {names.map((n) => (
            <li key={n}>
              <span>{n}</span>
              <button type="button" onClick={() => {
                const d = takeFromShelf(n);
                if (d) open(writeDesignFile(d), 0, `“${n}”`);
              }}>Open</button>
              <button type="button" aria-label={`Remove ${n}`} onClick={() => { removeFromShelf(n); setNames(shelfNames()); }}>Remove</button>
            </li>
          ))}
        </ul>
      ) : null}
      {note ? <p className={note.kind === 'error' ? 'field-error' : 'keep-ok'} role={note.kind === 'error' ? 'alert' : 'status'}>{note.text}</p> : null}
    </section>
  );
}

/** A file's text through FileReader, which every browser (and jsdom) has. */
function readText(file: File): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(String(reader.result));
    reader.onerror = () => reject(reader.error ?? new Error('the file could not be read'));
    reader.readAsText(file);
  });
}
