/**
 * For the clinician: the absolute risks, the risk ratio at this baseline, the risk difference
 * and the number needed, each with its interval and both absolute risks beside it, then every
 * warning in plain words and the teach-back questions. Rendered from the view model
 * (lib/consultation/view.ts).
 */
import { memo } from 'react';
import type { ClinicianPanelView } from '@/lib/consultation';

function ClinicianPanelInner({ view }: { view: ClinicianPanelView }) {
  return (
    <section className="clinician" aria-labelledby="clinician-heading">
      <h3 id="clinician-heading">For the clinician</h3>
      <dl className="figures">
        <div>
          <dt>Absolute risks</dt>
          <dd data-testid="clinician-absolute">{view.absoluteRisks}</dd>
        </div>
        <div>
          <dt>Risk ratio at this baseline</dt>
          <dd data-testid="clinician-risk-ratio">{view.riskRatio}</dd>
        </div>
        <div>
          <dt>Risk difference</dt>
          <dd data-testid="clinician-risk-difference">{view.riskDifference}</dd>
        </div>
        <div>
          <dt>Number needed</dt>
          <dd data-testid="clinician-number-needed">{view.numberNeeded}</dd>
        </div>
      </dl>
      <p className="note">{view.intervalNote}</p>
      <h4>Warnings</h4>
      {view.warnings.length > 0 ? (
        <ul className="warnings" data-testid="warnings">
          {view.warnings.map((warning) => (
            <li key={warning.code} data-code={warning.code}>
              {warning.message}
            </li>
          ))}
        </ul>
      ) : (
        <p data-testid="warnings-none">{view.noWarningsText}</p>
      )}
      {view.teachBack ? (
        <>
          <h4>Teach-back questions</h4>
          <p>{view.teachBack.intro}</p>
          <ol>
            {view.teachBack.questions.map((question) => (
              <li key={question}>{question}</li>
            ))}
          </ol>
        </>
      ) : null}
    </section>
  );
}

export const ClinicianPanel = memo(ClinicianPanelInner);
