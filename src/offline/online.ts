/** The browser's own word on the connection; anywhere else (a phone build, tests in Node) we assume online and let requests tell. */
export function browserOffline(): boolean {
  return typeof navigator !== 'undefined' && navigator.onLine === false;
}
