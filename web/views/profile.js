// The contractor's profile on the Saved quotes tab: the company block printed on every quote
// (name, address, phone, e-mail, licence number, logo), the default validity, the terms and the
// next quote number. Kept on this device; a new quote takes a copy.
import { h } from '../dom.js';

const FIELDS = [
  ['name', 'Company name', 'text', 200], ['address', 'Address', 'text', 300], ['phone', 'Phone', 'tel', 60],
  ['email', 'E-mail', 'email', 200], ['licence', 'Licence or registration number', 'text', 100],
];

/** One text input bound to a profile field (data-profile). */
function input(profile, [key, label, type, max]) {
  const id = `profile-${key}`;
  return h('div', { class: 'field' }, h('label', { for: id, text: label }),
    h('input', { id, type, autocomplete: 'off', maxlength: String(max), value: profile[key] ?? '', dataset: { profile: key } }));
}

/** Renders the profile group into `container` (the logo file input is kept from paint to paint). */
export function renderProfile(container, profile, message) {
  const logoInput = container.querySelector('#logo-file')
    ?? h('input', { id: 'logo-file', type: 'file', accept: 'image/png,image/jpeg,image/svg+xml,image/webp', class: 'visually-hidden' });
  container.replaceChildren(h('fieldset', { class: 'group', id: 'profile' },
    h('legend', { text: 'Your company, printed on every quote' }),
    h('p', { class: 'hint', text: 'Kept on this device. Each new quote takes a copy, with the next quote number; changes here also update the quote that is open.' }),
    h('div', { class: 'grid two' }, FIELDS.map((f) => input(profile, f))),
    h('div', { class: 'grid two' },
      h('div', { class: 'field' }, h('label', { for: 'profile-validity_days', text: 'Quotes hold for (days)' }),
        h('input', { id: 'profile-validity_days', type: 'text', inputmode: 'decimal', value: String(profile.validity_days), dataset: { profile: 'validity_days' } })),
      h('div', { class: 'field' }, h('label', { for: 'profile-next_number', text: 'Next quote number' }),
        h('input', { id: 'profile-next_number', type: 'text', inputmode: 'decimal', value: String(profile.next_number), dataset: { profile: 'next_number' } }))),
    h('div', { class: 'field' }, h('label', { for: 'profile-terms', text: 'Terms printed above the signatures' }),
      h('textarea', { id: 'profile-terms', rows: '3', maxlength: '4000', dataset: { profile: 'terms' } }, profile.terms ?? '')),
    h('div', { class: 'logo-row' },
      profile.logo ? h('img', { class: 'logo-preview', src: profile.logo, alt: 'Your logo' }) : h('span', { class: 'hint', text: 'No logo yet.' }),
      h('label', { class: 'button secondary', for: 'logo-file', text: profile.logo ? 'Change the logo' : 'Add a logo' }),
      logoInput,
      profile.logo ? h('button', { type: 'button', class: 'quiet', dataset: { action: 'remove-logo' }, text: 'Remove the logo' }) : null),
    h('p', { class: message?.ok === false ? 'field-msg' : 'field-msg ok', id: 'profile-msg', role: 'status', hidden: !message, text: message?.text ?? '' })));
}
