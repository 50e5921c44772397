import SelectField from './SelectField';

/** The subsystem a record or calculation is filed under: a labelled select with its field error (one copy for all). */
export default function SubsystemSelect({
  id,
  value,
  onChange,
  subsystems,
  error,
}: {
  id: string;
  value: string;
  onChange: (slug: string) => void;
  subsystems: { slug: string; name: string }[];
  error?: string;
}) {
  return (
    <SelectField
      id={id}
      label="Subsystem"
      value={value}
      onChange={onChange}
      options={subsystems.map((s) => ({ value: s.slug, label: s.name }))}
      error={error}
    />
  );
}
