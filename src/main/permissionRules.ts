/**
 * Permission requests (camera, notifications, clipboard reads, geolocation, …): the app needs none,
 * so every request and every check is denied (Electron security checklist, "Handle session
 * permission requests from remote content" — common practice).
 */
export function permissionDecision(_permission: string): false {
  return false;
}
