import { FACE_IDS, getFace, type FaceId } from '../core';
import { SelectField } from './SelectField';

/** A choice of target face from the core's list, labelled as the faces are. */
export function FaceSelect({ value, onChange }: { value: FaceId; onChange: (faceId: FaceId) => void }) {
  return (
    <SelectField label="Face" value={value} onChange={(e) => onChange(e.target.value as FaceId)}>
      {FACE_IDS.map((id) => (
        <option key={id} value={id}>
          {getFace(id).label}
        </option>
      ))}
    </SelectField>
  );
}
