/**
 * Escapes text for HTML element content and attribute values (&, <, >, ", ').
 * @param text - any value; converted with String().
 * @returns the escaped text.
 */
export function escapeHtml(text: unknown): string {
  return String(text)
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}
