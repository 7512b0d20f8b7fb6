/**
 * For the clinician: the absolute risks, the risk ratio at this baseline, the risk difference
 * and the number needed, each with its interval and both absolute risks beside it, then every
 * warning from the engine in plain words. Strings from lib/wording/clinician.ts.
 */
import { memo } from 'react';
import type { ClinicianText } from '@/lib/wording/clinician';

function ClinicianPanelInner({ text, teachBack, teachBackIntro }: { text: ClinicianText; teachBack: readonly string[]; teachBackIntro: string }) {
  return (
    <section className="clinician" aria-labelledby="clinician-heading">
      <h3 id="clinician-heading">For the clinician</h3>
      <dl className="figures">
        <div>
          <dt>Absolute risks</dt>
          <dd data-testid="clinician-absolute">{text.absoluteRisks}</dd>
        </div>
        <div>
          <dt>Risk ratio at this baseline</dt>
          <dd data-testid="clinician-risk-ratio">{text.riskRatio}</dd>
        </div>
        <div>
          <dt>Risk difference</dt>
          <dd data-testid="clinician-risk-difference">{text.riskDifference}</dd>
        </div>
        <div>
          <dt>Number needed</dt>
          <dd data-testid="clinician-number-needed">{text.numberNeeded}</dd>
        </div>
      </dl>
      <p className="note">{text.intervalNote}</p>
      <h4>Warnings</h4>
      {text.warnings.length > 0 ? (
        <ul className="warnings" data-testid="warnings">
          {text.warnings.map((warning) => (
            <li key={warning.code} data-code={warning.code}>
              {warning.message}
            </li>
          ))}
        </ul>
      ) : (
        <p data-testid="warnings-none">The engine raised no warning for these inputs.</p>
      )}
      <h4>Teach-back questions</h4>
      <p>{teachBackIntro}</p>
      <ol>
        {teachBack.map((question) => (
          <li key={question}>{question}</li>
        ))}
      </ol>
    </section>
  );
}

export const ClinicianPanel = memo(ClinicianPanelInner);
