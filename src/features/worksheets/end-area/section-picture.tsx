import { useState } from 'react';
import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import type { LengthUnit } from '@/shared/constants';
import { formatStation } from '@/shared/domain/earthwork/units';
import { SectionDrawing } from './section-drawing';
import type { WorkedSection } from './section-file';

/** The imported cross sections, one at a time. */
export function SectionPicture({ sections, unit }: { sections: readonly WorkedSection[]; unit: LengthUnit }) {
  const [index, setIndex] = useState(0);
  const shown = sections[Math.min(index, sections.length - 1)]!;
  return (
    <div className="space-y-2">
      <Field label="Cross section shown" className="max-w-48">
        {(c) => (
          <Select
            {...c}
            value={String(Math.min(index, sections.length - 1))}
            onChange={(e) => setIndex(Number(e.target.value))}
          >
            {sections.map((s, i) => (
              <option key={s.station} value={i}>
                Station {formatStation(s.shown ?? s.station, unit)}
                {s.shown !== undefined ? ` (continuous ${formatStation(s.station, unit)})` : ''}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <SectionDrawing section={shown} unit={unit} />
    </div>
  );
}
