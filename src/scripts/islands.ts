// Mounts the React islands of a page from one bundled module script (no inline scripts, nothing per island in
// the HTML but a data attribute). `src/components/Island.astro` writes
//   <div data-island="records/Comments" data-props='{…}' data-when="visible" [data-ssr] data-pending>…</div>
// and this script imports the named component only when the page has one (each is its own chunk), then hydrates
// the server's HTML (data-ssr) or replaces the fallback children with the component. `data-pending` gives way to
// `data-mounted` once React has committed, for tests and styles. See docs/decisions/020-islands-from-one-script.md.
import { createElement, useEffect, type ComponentType, type ReactNode } from 'react';
import { createRoot, hydrateRoot } from 'react-dom/client';

// Every island a page may name. A new island: add it here, then use <Island name="…"> in a page.
const registry = {
  'account/DigestToggle': () => import('../islands/account/DigestToggle'),
  'account/PasswordChange': () => import('../islands/account/PasswordChange'),
  'account/QuestionMailChoices': () => import('../islands/account/QuestionMailChoices'),
  'admin/Invitations': () => import('../islands/admin/Invitations'),
  'admin/PersonEditor': () => import('../islands/admin/PersonEditor'),
  'admin/SendDigest': () => import('../islands/admin/SendDigest'),
  'admin/StreamDownload': () => import('../islands/admin/StreamDownload'),
  'calc/CalculationActions': () => import('../islands/calc/CalculationActions'),
  'calc/CalculatorForm': () => import('../islands/calc/CalculatorForm'),
  'calc/SavedResult': () => import('../islands/calc/SavedResult'),
  'calc/TestLogOverlay': () => import('../islands/calc/TestLogOverlay'),
  'editor/RecordEditor': () => import('../islands/editor/RecordEditor'),
  'guides/GuideSuggestions': () => import('../islands/guides/GuideSuggestions'),
  'imports/ImportForm': () => import('../islands/imports/ImportForm'),
  'imports/ImportReview': () => import('../islands/imports/ImportReview'),
  'offline/PendingChanges': () => import('../islands/offline/PendingChanges'),
  'onboarding/NudgeButton': () => import('../islands/onboarding/NudgeButton'),
  'onboarding/RouteChecklist': () => import('../islands/onboarding/RouteChecklist'),
  'onboarding/RouteCurator': () => import('../islands/onboarding/RouteCurator'),
  'records/AttachmentUploader': () => import('../islands/records/AttachmentUploader'),
  'records/Comments': () => import('../islands/records/Comments'),
  'records/CsvPreview': () => import('../islands/records/CsvPreview'),
  'records/DiscardDraft': () => import('../islands/records/DiscardDraft'),
  'records/ReviewButton': () => import('../islands/records/ReviewButton'),
  'records/StatusControls': () => import('../islands/records/StatusControls'),
  'search/HeaderSearch': () => import('../islands/search/HeaderSearch'),
  'seasons/SeasonAdmin': () => import('../islands/seasons/SeasonAdmin'),
  'subsystems/CalculatorSetting': () => import('../islands/subsystems/CalculatorSetting'),
  'ui/LineChart': () => import('../islands/ui/LineChart'),
} satisfies Record<string, () => Promise<{ default: ComponentType<never> }>>;

export type IslandName = keyof typeof registry;

/** Marks the island mounted once React has committed it. A single child: React's useId paths stay the same. */
function Mounted({ el, children }: { el: HTMLElement; children?: ReactNode }) {
  useEffect(() => {
    el.removeAttribute('data-pending');
    el.setAttribute('data-mounted', '');
  }, [el]);
  return children;
}

async function mount(el: HTMLElement): Promise<void> {
  const name = el.dataset.island ?? '';
  const load = (registry as Record<string, (typeof registry)[IslandName] | undefined>)[name];
  if (!load) throw new Error(`No island named ${name}`);
  const { default: Component } = (await load()) as { default: ComponentType<Record<string, unknown>> };
  const props = JSON.parse(el.dataset.props ?? '{}') as Record<string, unknown>;
  const node = createElement(Mounted, { el }, createElement(Component, props));
  const identifierPrefix = el.dataset.prefix;
  if (el.hasAttribute('data-ssr')) hydrateRoot(el, node, { identifierPrefix });
  else createRoot(el, { identifierPrefix }).render(node);
}

/** Like client:visible: the island's own box is `display: contents`, so its children are watched. */
function whenVisible(el: HTMLElement, run: () => void): void {
  const targets = [...el.children];
  if (targets.length === 0 || !('IntersectionObserver' in window)) return run();
  const io = new IntersectionObserver((entries) => {
    if (!entries.some((e) => e.isIntersecting)) return;
    io.disconnect();
    run();
  });
  for (const t of targets) io.observe(t);
}

for (const el of document.querySelectorAll<HTMLElement>('[data-island][data-pending]')) {
  const run = () => void mount(el).catch((error: unknown) => console.error('island', el.dataset.island, error));
  if (el.dataset.when === 'visible') whenVisible(el, run);
  else run();
}
