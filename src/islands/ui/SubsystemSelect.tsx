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
    <div className="field">
      <label htmlFor={id}>Subsystem</label>
      <select
        id={id}
        className="input"
        value={value}
        onChange={(e) => onChange(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
      >
        {subsystems.map((s) => (
          <option key={s.slug} value={s.slug}>
            {s.name}
          </option>
        ))}
      </select>
      {error && (
        <p id={`${id}-error`} className="field-error">
          {error}
        </p>
      )}
    </div>
  );
}
