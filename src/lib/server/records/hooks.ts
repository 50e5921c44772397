// Other modules (search) register here to hear about record writes in the same request.
type Listener = (recordId: string) => void;
const listeners: Listener[] = [];

export function onRecordChangedListen(fn: Listener): void {
  listeners.push(fn);
}

export function onRecordChanged(recordId: string): void {
  for (const fn of listeners) fn(recordId);
}
