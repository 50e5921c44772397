import { statusInfo } from '~/lib/record-status';
import type { SearchHit } from '~/lib/search-types';

const TYPE_LABEL: Record<SearchHit['type'], string> = {
  guide: 'Guide',
  decision: 'Decision record',
  lesson: 'Lesson',
  calculation: 'Calculation',
};

/** "Decision record · Propulsion · 2025–26 · ✓ Accepted": what a hit is, in words. */
export function HitMeta({ hit, className }: { hit: SearchHit; className?: string }) {
  const parts = [TYPE_LABEL[hit.type], hit.subsystemName ?? hit.subsystem, hit.season];
  const status = hit.status && hit.type !== 'guide' && hit.type !== 'calculation' ? statusInfo(hit.status) : null;
  return (
    <span className={className}>
      {parts.filter(Boolean).join(' · ')}
      {status && (
        <>
          {' · '}
          <span aria-hidden="true">{status.symbol}</span> {status.label}
        </>
      )}
    </span>
  );
}
