/** Words and symbols for record statuses, so status is never told by colour alone. */
const STATUS: Record<string, { label: string; symbol: string; help: string }> = {
  draft: { label: 'Draft', symbol: '✎', help: 'Still being written' },
  proposed: { label: 'Proposed', symbol: '?', help: 'Put to the team for a decision' },
  accepted: { label: 'Accepted', symbol: '✓', help: 'Decided and in force' },
  superseded: { label: 'Superseded', symbol: '↷', help: 'Replaced by a later decision' },
  withdrawn: { label: 'Withdrawn', symbol: '✕', help: 'Dropped without replacement' },
  open: { label: 'Open', symbol: '!', help: 'Lesson not yet acted on' },
  addressed: { label: 'Addressed', symbol: '✓', help: 'Lesson acted on' },
};

export function statusInfo(status: string) {
  return STATUS[status] ?? { label: status, symbol: '•', help: '' };
}
