/**
 * The standing caution. Tube amplifiers hold lethal voltages; the page says
 * so plainly and defers to local codes and licensed practice.
 */
export function SafetyNotice({ compact = false }: { compact?: boolean }) {
  return (
    <aside className={compact ? 'safety safety-compact' : 'safety'} aria-label="Safety caution">
      <strong>Danger: lethal voltages.</strong>{' '}
      Tube amplifiers run at hundreds of volts, and filter capacitors hold a charge long after the power is off.
      Work with one hand, unplug and discharge the capacitors through a resistor, and measure before you touch.
      The figures here are a design aid, not a safety approval: follow your local electrical codes, and have
      mains wiring done or checked by a licensed person.
    </aside>
  );
}
