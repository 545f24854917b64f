import { useId, useState, type FormEvent } from 'react';
import { parseValue } from '../../../src/index';
import { useWorkbench } from '../../store/StoreProvider';

/**
 * Inverse design in words: type the plate voltage and current wanted, and the
 * model gives the bias that sets them (Rk snapped to the series, or the grid
 * supply) and the B+ that puts the plate there. The same as dragging the
 * point, for when the numbers are known.
 */
export function WantedPoint() {
  const placeOutputPoint = useWorkbench((s) => s.placeOutputPoint);
  const bias = useWorkbench((s) => s.design.output.bias);
  const [vpk, setVpk] = useState('');
  const [ia, setIa] = useState('');
  const [note, setNote] = useState<{ ok: boolean; text: string } | null>(null);
  const id = useId();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const v = parseValue(vpk);
    const i = parseValue(ia);
    if (!v.ok) return setNote({ ok: false, text: `Plate voltage: ${v.message}` });
    if (!i.ok) return setNote({ ok: false, text: `Plate current: ${i.message}` });
    const failure = placeOutputPoint(v.value, i.value / 1000);
    if (failure) return setNote({ ok: false, text: failure.message });
    return setNote({ ok: true, text: 'Bias and B+ set for that point.' });
  };
  return (
    <form className="wanted-point" onSubmit={submit} aria-labelledby={`${id}-h`}>
      <h3 id={`${id}-h`} className="subhead">Bias for a wanted point</h3>
      <div className="option-row">
        <label>
          Vpk (V) <input name="wanted-vpk" size={6} value={vpk} placeholder="300" onChange={(e) => setVpk(e.target.value)} />
        </label>
        <label>
          Ia (mA) <input name="wanted-ia" size={6} value={ia} placeholder="70" onChange={(e) => setIa(e.target.value)} />
        </label>
        <button type="submit">Set {bias === 'cathode' ? 'Rk' : 'grid bias'} and B+</button>
      </div>
      {note ? <p className={note.ok ? 'field-hint' : 'field-error'} role={note.ok ? 'status' : 'alert'}>{note.text}</p> : null}
    </form>
  );
}

