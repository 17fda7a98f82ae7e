// The contractor's profile and the quote's paperwork, pure part (tested in Node): the company block
// kept on the device and copied into each new quote, quote numbers from a counter per device, the
// valid-until date, net prices and the monthly payment of a loan.

/** The profile a device starts with: nothing printed until the contractor fills it in. */
export const BLANK_PROFILE = Object.freeze({
  name: '', address: '', phone: '', email: '', licence: '', logo: '', validity_days: 30, terms: '', next_number: 1, number_prefix: 'Q-',
});

/** The largest logo kept (bytes of its data URL): a small image prints sharply and keeps the quote files small. */
export const MAX_LOGO_BYTES = 300_000;

const text = (v, max) => (typeof v === 'string' ? v.slice(0, max) : '');

/** A profile read from storage or a file, every field of the right type (unknown fields dropped). */
export function normalizeProfile(raw) {
  const p = raw && typeof raw === 'object' ? raw : {};
  const days = Number(p.validity_days);
  const next = Number(p.next_number);
  return {
    name: text(p.name, 200), address: text(p.address, 300), phone: text(p.phone, 60), email: text(p.email, 200),
    licence: text(p.licence, 100), logo: typeof p.logo === 'string' && p.logo.startsWith('data:image/') && p.logo.length <= MAX_LOGO_BYTES ? p.logo : '',
    validity_days: Number.isInteger(days) && days >= 1 && days <= 365 ? days : BLANK_PROFILE.validity_days,
    terms: text(p.terms, 4000),
    next_number: Number.isInteger(next) && next >= 1 ? next : 1,
    number_prefix: typeof p.number_prefix === 'string' ? p.number_prefix.slice(0, 12) : BLANK_PROFILE.number_prefix,
  };
}

/** The company block a quote carries (only the fields filled in), or undefined for an empty profile. */
export function companyOf(profile) {
  const company = {};
  for (const key of ['name', 'address', 'phone', 'email', 'licence', 'logo']) if (profile[key]) company[key] = profile[key];
  return Object.keys(company).length ? company : undefined;
}

/** The next quote number ("Q-0042") and the profile with its counter moved on. */
export function takeQuoteNumber(profile) {
  const number = `${profile.number_prefix}${String(profile.next_number).padStart(4, '0')}`;
  return { number, profile: { ...profile, next_number: profile.next_number + 1 } };
}

/** [YYYY-MM-DD] The last day a quote dated `dateIso` holds, `days` later (calendar days, UTC). */
export function validUntil(dateIso, days) {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(dateIso ?? '');
  if (!m || !Number.isFinite(days)) return '';
  const t = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])) + days * 86_400_000;
  return new Date(t).toISOString().slice(0, 10);
}

/**
 * [currency/month] The monthly payment of a loan of `principal` at `annualRate` (a fraction a year,
 * compounded monthly) over `years`: P r / (1 - (1 + r)^-n) with r = rate / 12 and n = 12 years (the
 * standard amortization formula); P / n at 0 %. Undefined without a principal, rate or term.
 */
export function monthlyPayment(principal, annualRate, years) {
  if (!(principal > 0) || !(annualRate >= 0) || !(years > 0)) return undefined;
  const n = Math.round(years * 12);
  const r = annualRate / 12;
  return r === 0 ? principal / n : (principal * r) / (1 - (1 + r) ** -n);
}

/** An option's price on the sheet: installed, incentives, net and the monthly payment where a loan is offered. */
export function optionPrice(system, financing) {
  const installed = typeof system.installed_cost === 'number' ? system.installed_cost : undefined;
  if (installed === undefined) return null;
  const incentives = typeof system.incentives === 'number' ? system.incentives : 0;
  const net = installed - incentives;
  return { installed, incentives, net, monthly: monthlyPayment(net, financing?.rate, financing?.years) };
}
