/**
 * A file name made from text the user wrote (a project or candidate name): the characters file
 * systems refuse replaced by "-", and no leading or trailing dots or spaces. Windows forbids
 * <>:"/\|?* and control characters in names (Microsoft, "Naming Files, Paths, and Namespaces");
 * POSIX forbids only / and NUL — the stricter set keeps files portable. The renderer builds
 * suggested export names with it (a candidate "PI (25 %/K, 30 min)" gave a name with a "/", which
 * the export channel rightly refuses), and the main process cleans the names it suggests with it.
 *
 * ```ts
 * fileNameText('value-surface-PI (25 %/K, 30 min)'); // 'value-surface-PI (25 %-K, 30 min)'
 * ```
 */
export function fileNameText(name: string): string {
  return name.replace(/[<>:"/\\|?*\u0000-\u001f]/g, '-').replace(/^[\s.]+|[\s.]+$/g, '');
}
