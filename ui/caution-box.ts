/**
 * The caution box beside the verdict: the general hazards and the closing sentence from the one wording table (the
 * CLI prints the same list after every run), and room for the cautions of the scenario on screen (ui/cautions.ts),
 * which the verdict fills. Test hooks: `cautions`, `scenario-cautions`.
 */
import { hazards, hazardsHeading, predictionNotCertification } from '../sim/index.ts';
import { h } from './dom.ts';

/** Fills the box; returns the list the verdict fills with this scenario's cautions. */
export function renderCautionBox(box: HTMLElement): HTMLElement {
  const scenarioList = h('ul', { class: 'scenario-cautions', 'data-testid': 'scenario-cautions', 'aria-label': 'cautions for this scenario', hidden: true });
  box.setAttribute('data-testid', 'cautions');
  box.replaceChildren(
    h('strong', {}, `${hazardsHeading}.`),
    h('ul', { class: 'hazards' }, ...hazards.map((z) => h('li', {}, h('strong', {}, z.term), ` ${z.definition}`))),
    scenarioList,
    h('p', { class: 'certification' }, h('em', {}, predictionNotCertification)));
  return scenarioList;
}
