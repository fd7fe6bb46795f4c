/**
 * File names the app suggests and accepts: the project extension, and the extension of each export
 * kind. Some platforms' save dialogs (GTK on Linux) return the name as typed, without the filter's
 * extension, so it is added here.
 */
import type { ExportKind } from '../shared/appApi';
import { fileNameText } from '../shared/fileNameText';

export const PROJECT_EXTENSION = '.spcritic';

export const EXPORT_EXTENSIONS: Readonly<Record<ExportKind, string>> = { png: '.png', svg: '.svg', csv: '.csv', html: '.html', pdf: '.pdf' };

/** `path` with `extension` appended unless it already ends with it (any letter case). */
export function withExtension(path: string, extension: string): string {
  return path.toLowerCase().endsWith(extension) ? path : `${path}${extension}`;
}

/** A name for a save dialog: characters file systems refuse replaced, never empty. */
export function suggestedFileName(name: string, extension: string, fallback = 'Untitled project'): string {
  const cleaned = fileNameText(name); // the characters Windows refuses, as in the renderer’s suggested names
  return withExtension(cleaned === '' ? fallback : cleaned, extension);
}
