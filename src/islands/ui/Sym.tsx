import { symbolParts } from '~/lib/symbols';

/** Text from a calculator (label, help, warning) with its symbols' subscripts shown as subscripts: K<sub>T</sub>. */
export default function Sym({ text }: { text: string }) {
  return <>{symbolParts(text).map((p, i) => (p.sub ? <sub key={i}>{p.text}</sub> : p.text))}</>;
}
