// Modules that keep derived data (the search index) register here to hear about writes in the same request.
type Listener = (id: string) => void;
const recordListeners: Listener[] = [];
const calculationListeners: Listener[] = [];

export function onRecordChangedListen(fn: Listener): void {
  recordListeners.push(fn);
}

export function onRecordChanged(recordId: string): void {
  for (const fn of recordListeners) fn(recordId);
}

export function onCalculationChangedListen(fn: Listener): void {
  calculationListeners.push(fn);
}

export function onCalculationChanged(calculationId: string): void {
  for (const fn of calculationListeners) fn(calculationId);
}
