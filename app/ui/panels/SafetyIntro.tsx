import { useState } from 'react';

const KEY = 'quiescent.safety-acknowledged';

function acknowledged(): boolean {
  try {
    return globalThis.localStorage?.getItem(KEY) === '1';
  } catch {
    return false; // storage blocked: show the caution every time
  }
}

/** The safety caution shown prominently on a first visit, until the user acknowledges it. The footer keeps it reachable afterwards. */
export function SafetyIntro() {
  const [open, setOpen] = useState(() => !acknowledged());
  if (!open) return null;
  const close = () => {
    try {
      globalThis.localStorage?.setItem(KEY, '1');
    } catch {
      /* storage blocked: nothing to remember */
    }
    setOpen(false);
  };
  return (
    <section className="safety-intro" role="region" aria-label="Safety first">
      <h2>Before you build: these circuits can kill</h2>
      <p>
        Tube amplifiers run at hundreds of volts DC, and their filter capacitors stay charged after switch-off. Unplug,
        discharge every capacitor through a resistor and check with a meter before you touch anything; probe live circuits
        with one hand only. Quiescent computes from a model: its figures are a design aid, not a safety approval. Follow
        your local electrical codes, and leave mains wiring to, or have it checked by, a licensed person.
      </p>
      <button type="button" onClick={close}>I understand</button>
    </section>
  );
}
