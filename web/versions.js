// Format versions of the documents the page reads (scenario files, saved
// quotes): which version a document says it is, and what to tell the user
// when it is newer than this page or in a form it does not know.

/** The version number in `value` when it reads `<family>/<n>` (n a whole number from 1), else null. */
export function versionOf(value, family) {
  if (typeof value !== 'string' || !value.startsWith(`${family}/`)) return null;
  const number = value.slice(family.length + 1);
  return /^[1-9]\d{0,8}$/.test(number) ? Number(number) : null;
}

/** Why a document whose `field` holds `value` cannot be read by a page that reads `what` up to `<family>/<newest>`. */
export function unreadableVersionMessage(value, { family, newest, what, field }) {
  const reads = `this version reads ${what} up to ${family}/${newest}`;
  const version = versionOf(value, family);
  if (version !== null && version > newest) return `it was saved by a newer version of Fuelwright (${value}); ${reads}`;
  const shown = typeof value === 'string' ? `"${value}"` : 'missing';
  return `it is in a format this version of Fuelwright does not know (${field} ${shown}), perhaps from a newer version of Fuelwright; ${reads}`;
}
