import type { EditionData } from './edition-data.js';

/**
 * The edition as a jurisdiction amends it: each chosen amendment's parameters replace the model
 * code's, and the strategies they touch carry the amendment as their source. The model code's own
 * tables are never changed; a project that chooses no amendment evaluates against them as they are.
 */
export function amendedEdition(edition: EditionData, keys: readonly string[]): EditionData {
  if (keys.length === 0) return edition;
  const chosen = (edition.amendments ?? []).filter((amendment) => keys.includes(amendment.key));
  if (chosen.length === 0) return edition;
  return {
    ...edition,
    controlStrategies: edition.controlStrategies.map((strategy) => {
      const layers = chosen.filter((amendment) => amendment.parameters[strategy.key] !== undefined);
      if (layers.length === 0) return strategy;
      const parameters = Object.assign({}, strategy.parameters, ...layers.map((amendment) => amendment.parameters[strategy.key]));
      const titles = layers.map((amendment) => amendment.title).join('; ');
      return {
        ...strategy,
        parameters,
        provenance: {
          source: `${titles} (amending ${edition.title})`,
          confidence: layers.every((amendment) => amendment.provenance.verified) ? strategy.provenance.confidence : 'low',
          verified: layers.every((amendment) => amendment.provenance.verified) && strategy.provenance.verified,
          note: layers
            .map((amendment) => amendment.provenance.note ?? '')
            .filter(Boolean)
            .join(' '),
        },
      };
    }),
  };
}
