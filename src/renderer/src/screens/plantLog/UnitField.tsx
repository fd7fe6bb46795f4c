/**
 * A column's unit in the Plant log's role table. The field shows what the user types, spaces and all,
 * while the document holds the unit trimmed (project/unitText.ts), so "kg " on the way to "kg/h" is
 * never cut short and nothing downstream trims. One undo step per field until it loses focus.
 */
import { useEffect, useState } from 'react';
import { heldUnit } from '../../../../project/unitText';

export interface UnitFieldProps {
  id: string;
  testId: string;
  /** The unit as the document holds it. */
  value: string;
  placeholder: string;
  title?: string;
  /** Writes the held (trimmed) unit to the document. */
  onChange: (unit: string) => void;
  onBlur: () => void;
}

export function UnitField({ id, testId, value, placeholder, title, onChange, onBlur }: UnitFieldProps) {
  const [typed, setTyped] = useState(value);
  // An undo, a load or a role change sets the unit from outside: show it unless it is what is being typed.
  useEffect(() => setTyped((t) => (heldUnit(t) === value ? t : value)), [value]);
  return (
    <input
      id={id} data-testid={testId} value={typed} placeholder={placeholder} size={8} title={title}
      onChange={(e) => { setTyped(e.target.value); onChange(heldUnit(e.target.value)); }}
      onBlur={() => { setTyped(value); onBlur(); }}
    />
  );
}
