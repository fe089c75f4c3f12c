/** Small choices remembered on this device (which car and driver at an event), never anything private. */
export function readStoredChoice<T extends object>(key: string): Partial<T> | null {
  try {
    const raw = window.localStorage.getItem(key);
    if (!raw) return null;
    const value = JSON.parse(raw) as unknown;
    return typeof value === 'object' && value !== null ? (value as Partial<T>) : null;
  } catch {
    return null;
  }
}

export function writeStoredChoice(key: string, value: object): void {
  try {
    window.localStorage.setItem(key, JSON.stringify(value));
  } catch {
    // Private mode or a full disk: the choice is simply asked again next time.
  }
}
