import { Field } from '@/components/ui/field';
import { Select } from '@/components/ui/select';
import { DEFAULT_MATERIALS, MATERIAL_TABLE_LABEL, type MaterialFactors } from '@/shared/domain/earthwork/materials';

/** Fills swell (and angle of repose) from the editable default table; the numbers stay editable. */
export function MaterialPicker({ onPick }: { onPick: (material: MaterialFactors) => void }) {
  return (
    <Field label="Fill in from a material" hint={MATERIAL_TABLE_LABEL}>
      {(c) => (
        <Select
          {...c}
          defaultValue=""
          onChange={(e) => {
            const m = DEFAULT_MATERIALS.find((x) => x.id === e.target.value);
            if (m) onPick(m);
          }}
        >
          <option value="">Choose a material…</option>
          {DEFAULT_MATERIALS.map((m) => (
            <option key={m.id} value={m.id}>
              {m.name}: swell {m.swellPercent} %{m.angleOfReposeDeg ? `, repose ${m.angleOfReposeDeg}°` : ''}
            </option>
          ))}
        </Select>
      )}
    </Field>
  );
}
