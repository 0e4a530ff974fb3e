/**
 * The wiring sheet as a document: the header (engine, plan, verdict, date printed, a line for the
 * restorer's name and sign-off), the cautions BEFORE the first step and never folded, the stages
 * with their ordered steps (tick box, terminals, what to do, and for a measuring step where the
 * probes go, the state of the car, the expected value and band, how it was found, a box for the
 * reading and the likely causes), and the wiring diagram.
 *
 * Pure: props in, markup out. No bridge, no fetching, no window or document at render time, so the
 * command line renders it to static HTML with renderToStaticMarkup. The screen passes `tickSlot`
 * and `readingSlot` to put its live tick boxes and reading entry where the print has empty boxes;
 * everything a slot adds is screen-only (the print shows the printed boxes, filled in from
 * `ticked` and `taken`).
 */
import type { ReactNode } from 'react';
import { WiringDiagram } from '../diagram/WiringDiagram.js';
import { bandSentence, bandText, gapText, quantityText, statusWords, unitText, valueText, verdictWords } from './format.js';
import { BandMark, CautionMark, VerdictMark } from './Marks.js';
import type { JudgedReading, Sheet, SheetStep } from './model.js';

export type PageSize = 'A4' | 'Letter';

export type SheetDocumentProps = {
  sheet: Sheet;
  /** Step keys already ticked: their printed box carries a tick. */
  ticked?: ReadonlySet<string>;
  /** The latest reading per step, judged: written into the printed reading box, flagged when out of its band. */
  taken?: ReadonlyMap<string, JudgedReading & { takenOn?: string }>;
  /** The screen's live tick box for a step; the printed box is then shown in print only. */
  tickSlot?: (step: SheetStep) => ReactNode;
  /** Screen-only words under a step's sentence (a failed tick's message). */
  noteSlot?: (step: SheetStep) => ReactNode;
  /** The screen's reading entry beside a measuring step (screen only). */
  readingSlot?: (step: SheetStep) => ReactNode;
  /** Which named @page the print uses (sheet.css: sheet-a4, sheet-letter). */
  pageSize?: PageSize;
  /** 1 when the sheet is the page itself (the command line's HTML), 2 under a screen's own h1. */
  headingLevel?: 1 | 2;
};

function Heading({ level, id, className, children }: { level: number; id?: string; className?: string; children: ReactNode }): ReactNode {
  const Tag = (`h${Math.min(6, level)}` as 'h1' | 'h2' | 'h3' | 'h4' | 'h5' | 'h6');
  return (
    <Tag id={id} className={className}>
      {children}
    </Tag>
  );
}

const earthWords = (e: Sheet['header']['engine']): string =>
  e.earthPolarity === 'positive' ? 'positive earth (battery positive to the body: 31 is battery positive)' : 'negative earth (battery negative to the body)';

function Header({ sheet, level }: { sheet: Sheet; level: number }): ReactNode {
  const { engine, plan, verdict, existingLine, printedOn } = sheet.header;
  const about = [engine.yearText, engine.modelText].filter((t) => t.trim() !== '').join(' ');
  const gap = plan.suggestedGapMm !== null && Math.abs(plan.suggestedGapMm - plan.plugGapMm) > 0.005 ? `${gapText(plan.plugGapMm)}; the checker suggests ${gapText(plan.suggestedGapMm)}` : gapText(plan.plugGapMm);
  return (
    <header className="sheet-head" data-testid="sheet-head">
      <Heading level={level} className="sheet-title">
        Wiring sheet: {plan.name}
      </Heading>
      <p className="sheet-engine-line">
        <strong>{engine.name}</strong>
        {about ? ` — ${about}` : ''}
      </p>
      <p className={`sheet-verdict verdict-${verdict.verdict}`} data-verdict={verdict.verdict} data-testid="sheet-verdict">
        <VerdictMark verdict={verdict.verdict} />
        <span>
          <strong>{verdictWords[verdict.verdict]}:</strong> {verdict.line}
        </span>
      </p>
      <div className="sheet-facts">
        <dl className="facts">
          <dt>Engine</dt>
          <dd>
            {engine.cylinders} cylinders, {engine.systemVoltageV} V, {earthWords(engine)}, {engine.charging}; firing order {engine.firingOrder}
          </dd>
          <dt>Fitted today</dt>
          <dd>{existingLine}</dd>
          <dt>Switching</dt>
          <dd>{plan.switching}</dd>
          {plan.moduleFeed ? (
            <>
              <dt>Module feed</dt>
              <dd>{plan.moduleFeed}</dd>
            </>
          ) : null}
        </dl>
        <dl className="facts">
          <dt>Coil</dt>
          <dd>{plan.coil}</dd>
          <dt>Ballast</dt>
          <dd>{plan.ballast}</dd>
          <dt>Cranking bypass</dt>
          <dd>{plan.crankingBypass ? 'Yes: the starter circuit feeds the coil directly while cranking' : 'None'}</dd>
          <dt>Rev counter</dt>
          <dd>{plan.tach}</dd>
          <dt>Leads and plugs</dt>
          <dd>
            {plan.leads}; {plan.plug}, gap {gap}
          </dd>
        </dl>
      </div>
      <div className="sheet-sign">
        <span>
          Printed on <strong data-testid="sheet-printed-on">{printedOn}</strong>
        </span>
        <span>
          Plan: <strong>{statusWords[plan.status]}</strong>
        </span>
        <span className="sign-line">
          Work done by <span className="blank wide" />
        </span>
        <span className="sign-line">
          Signed off on <span className="blank" />
        </span>
      </div>
    </header>
  );
}

function SheetCautions({ cautions, level }: { cautions: Sheet['cautions']; level: number }): ReactNode {
  return (
    <section className="sheet-cautions" aria-labelledby="sheet-cautions-title" data-testid="sheet-cautions">
      <Heading level={level} id="sheet-cautions-title">
        <CautionMark />
        Read this before you touch the wiring
      </Heading>
      <ul>
        {cautions.map((c) => (
          <li key={c.id} data-caution={c.id}>
            {c.text}
          </li>
        ))}
      </ul>
    </section>
  );
}

function PrintedBox({ on, screenToo }: { on: boolean; screenToo: boolean }): ReactNode {
  return (
    <span className={`tick-box${on ? ' on' : ''}${screenToo ? '' : ' print-only'}`} aria-hidden="true">
      {on ? '✓' : ''}
    </span>
  );
}

function ReadingBlock({ step, taken }: { step: SheetStep; taken: (JudgedReading & { takenOn?: string }) | undefined }): ReactNode {
  const r = step.reading!;
  const out = taken && taken.band !== 'in';
  return (
    <div className={`step-reading${out ? ' is-out' : ''}`}>
      <dl className="reading-facts">
        <dt>Measure</dt>
        <dd>{quantityText(r.quantity)}</dd>
        <dt>Probes</dt>
        <dd>{r.probes}</dd>
        <dt>The car</dt>
        <dd>{r.state}</dd>
        <dt>Expect</dt>
        <dd className="expect" data-testid={`expect-${step.key}`}>
          <strong>{valueText(r.expected, r.unit)}</strong> <span className="band">(from {bandText(r)})</span>
        </dd>
        <dt>How found</dt>
        <dd className="how">
          {r.how} <span className="source">Source: {r.source}.</span>
        </dd>
      </dl>
      <div className="reading-box" data-testid={`reading-box-${step.key}`}>
        <span className="box-label">You read</span>
        <span className="box-value">{taken ? valueText(taken.value, r.unit) : ''}</span>
        <span className="box-unit">{taken ? '' : unitText(r.unit)}</span>
        {taken?.takenOn ? <span className="box-date">on {taken.takenOn}</span> : null}
      </div>
      {taken ? (
        <p className={`band-flag band-${taken.band}`} data-band={taken.band} data-testid={`flag-${step.key}`}>
          <BandMark band={taken.band} />
          {bandSentence(taken.band, taken.value, r)}
        </p>
      ) : null}
      {r.ifOutOfRange.length > 0 ? (
        <div className={`causes${out ? ' causes-now' : ''}`} data-testid={`causes-${step.key}`}>
          <p className="causes-lead">{out ? 'Most likely causes, in order; check the first before the next:' : 'If it reads outside the band, most likely (in order):'}</p>
          <ol>
            {r.ifOutOfRange.map((c, i) => (
              <li key={i}>{c}</li>
            ))}
          </ol>
        </div>
      ) : null}
    </div>
  );
}

function Step({ step, n, props, level }: { step: SheetStep; n: number; props: SheetDocumentProps; level: number }): ReactNode {
  const ticked = props.ticked?.has(step.key) ?? false;
  const slot = props.tickSlot?.(step);
  return (
    <li className={`sheet-step${step.reading ? ' measuring' : ''}${ticked ? ' is-ticked' : ''}`} data-step={step.key} data-testid={`step-${step.key}`}>
      <div className="step-tick">
        <PrintedBox on={ticked} screenToo={!slot} />
        {slot ? <span className="sheet-live">{slot}</span> : null}
      </div>
      <div className="step-body">
        <Heading level={level} className="step-title">
          <span className="step-no">{n}.</span> {step.title}
        </Heading>
        {step.terminals.length > 0 ? (
          <p className="step-terminals">
            <span className="label">Terminals:</span>{' '}
            {step.terminals.map((t, i) => (
              <span key={i} className="terminal">
                {t}
              </span>
            ))}
          </p>
        ) : null}
        <p className="step-text">{step.text}</p>
        {props.noteSlot ? <div className="sheet-live">{props.noteSlot(step)}</div> : null}
        {step.reading ? <ReadingBlock step={step} taken={props.taken?.get(step.key)} /> : null}
        {step.reading && props.readingSlot ? <div className="sheet-live reading-live">{props.readingSlot(step)}</div> : null}
      </div>
    </li>
  );
}

export function SheetDocument(props: SheetDocumentProps): ReactNode {
  const { sheet, pageSize = 'A4', headingLevel = 2 } = props;
  const h = headingLevel;
  let n = 0;
  return (
    <article className={`sheet-doc page-${pageSize === 'Letter' ? 'letter' : 'a4'}`} data-testid="sheet-document">
      {/* A table whose head Chromium repeats at the top of every printed page. */}
      <table className="sheet-frame">
        <thead className="sheet-running">
          <tr>
            <td>
              <div className="running-head">
                <span>Wiring sheet · {sheet.header.engine.name}</span>
                <span>{sheet.header.plan.name}</span>
                <span>Printed {sheet.header.printedOn}</span>
              </div>
            </td>
          </tr>
        </thead>
        <tbody>
          <tr>
            <td>
              <Header sheet={sheet} level={h} />
              <SheetCautions cautions={sheet.cautions} level={h + 1} />
              {sheet.stages.map((stage) => (
                <section key={stage.id} className="sheet-stage" aria-labelledby={`stage-${stage.id}`} data-stage={stage.id}>
                  <Heading level={h + 1} id={`stage-${stage.id}`} className="stage-title">
                    {stage.title}
                  </Heading>
                  {stage.intro ? <p className="stage-intro">{stage.intro}</p> : null}
                  <ol className="sheet-steps">
                    {stage.steps.map((step) => (
                      <Step key={step.key} step={step} n={++n} props={props} level={h + 2} />
                    ))}
                  </ol>
                </section>
              ))}
              <section className="sheet-diagram" aria-labelledby="sheet-diagram-title">
                <Heading level={h + 1} id="sheet-diagram-title">
                  Wiring diagram
                </Heading>
                <WiringDiagram diagram={sheet.diagram} />
              </section>
              <p className="sheet-defer">
                This sheet is a planning aid. The vehicle’s service data, the module maker’s instructions, local regulations and licensed practice come first.
              </p>
            </td>
          </tr>
        </tbody>
      </table>
    </article>
  );
}
