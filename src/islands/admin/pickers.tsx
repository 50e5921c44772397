// The role list and the "owns these subsystems" checkboxes, shared by the invitation form and the person editor.
import type { Role } from '~/lib/domain';
import { ROLE_LABELS } from '~/lib/policy';

/** One <option> per role, in the policy's order. */
export function RoleOptions() {
  return (
    <>
      {(Object.keys(ROLE_LABELS) as Role[]).map((r) => (
        <option key={r} value={r}>
          {ROLE_LABELS[r]}
        </option>
      ))}
    </>
  );
}

interface SubsystemChecksProps {
  subsystems: { slug: string; name: string }[];
  owned: string[];
  onChange: (owned: string[]) => void;
  /** Grid classes: the invitation form is wider than the person editor. */
  className: string;
}

/** A checkbox per subsystem; ticking one adds its slug to `owned`. */
export function SubsystemChecks({ subsystems, owned, onChange, className }: SubsystemChecksProps) {
  return (
    <div className={className}>
      {subsystems.map((s) => (
        <label key={s.slug} className="flex items-center gap-1.5">
          <input
            type="checkbox"
            checked={owned.includes(s.slug)}
            onChange={(e) => onChange(e.target.checked ? [...owned, s.slug] : owned.filter((x) => x !== s.slug))}
          />
          {s.name}
        </label>
      ))}
    </div>
  );
}
