// The fields of a water heater (the house's on the House tab, an option's own on the Systems tab): its kind,
// fuel, rating (UEF) and where it stands; an indirect tank or a combi boiler is heated by the boiler.
import { h } from '../dom.js';
import { numberField, selectField } from '../fields.js';
import { BOILER_WATER_HEATERS } from '../scenario.js';

export const WATER_HEATER_KINDS = [
  ['storage', 'Storage tank with its own burner or element'],
  ['tankless', 'Tankless (on demand)'],
  ['heat-pump-water-heater', 'Heat-pump water heater'],
  ['indirect', 'Indirect tank heated by the boiler'],
  ['combi', 'Combi boiler (heats the house and the water)'],
];

/** Fuels a water heater runs on (no solid fuels). */
function heaterFuels(catalog, kind) {
  if (kind === 'heat-pump-water-heater') return [['electricity', 'Electricity']];
  return (catalog.fuels ?? []).filter((f) => f.category !== 'solid').map((f) => [f.id, f.name]);
}

/**
 * The water-heater fields at `base` (a path whose object is the heater); `boiler` false leaves out the kinds a boiler
 * heats (an option without a boiler cannot have them).
 */
export function waterHeaterFields(ctx, base, heater = {}, { boiler = true } = {}) {
  const kind = heater.kind ?? '';
  const kinds = WATER_HEATER_KINDS.filter(([k]) => boiler || !BOILER_WATER_HEATERS.includes(k) || k === kind);
  const nodes = [selectField(ctx, { label: 'Kind of water heater', path: `${base}/kind`, value: kind, structural: true,
    choices: [['', 'Choose…'], ...kinds] })];
  if (!kind) return nodes;
  if (BOILER_WATER_HEATERS.includes(kind)) {
    nodes.push(h('p', { class: 'hint', text: kind === 'indirect'
      ? 'The boiler heats the tank at its own seasonal efficiency; the tank\'s standby loss is made up by the boiler too.'
      : 'The boiler heats the water as it is drawn, at its seasonal efficiency.' }));
    if (kind === 'indirect') {
      nodes.push(numberField(ctx, { label: 'Tank standby loss (optional)', path: `${base}/standby_loss/value`, value: heater.standby_loss?.value,
        unit: { path: `${base}/standby_loss/unit`, value: heater.standby_loss?.unit ?? 'W', choices: ['W', 'Btu/h'] },
        placeholder: '50', hint: 'About 50 W for a well-insulated 40 to 50 gal tank when left empty.' }));
    }
  } else {
    const fuels = heaterFuels(ctx.catalog, kind);
    nodes.push(h('div', { class: 'grid two' },
      // one fuel to run on (a heat-pump water heater's electricity) is shown as chosen, as the scenario sends it
      selectField(ctx, { label: 'Runs on', path: `${base}/fuel`, value: heater.fuel || (fuels.length === 1 ? fuels[0][0] : ''), structural: true,
        choices: fuels.length === 1 ? fuels : [['', 'Choose…'], ...fuels] }),
      numberField(ctx, { label: 'Uniform energy factor (UEF)', path: `${base}/uef`, value: heater.uef,
        hint: kind === 'heat-pump-water-heater' ? 'On the label, e.g. 3.5.' : 'On the label, e.g. 0.64 for a gas tank, 0.93 for an electric one.' })));
  }
  nodes.push(selectField(ctx, { label: 'Where it stands', path: `${base}/location`, value: heater.location ?? '',
    choices: [['', 'Not said'], ['conditioned', 'Inside the heated space'], ['unconditioned', 'Outside it (garage, unheated basement)']],
    hint: kind === 'heat-pump-water-heater'
      ? 'Inside the heated space it takes heat from the room air, which the heating then makes up in winter.' : undefined }));
  return nodes;
}
