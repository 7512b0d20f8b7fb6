/** "How this was worked out": every step's formula, the numbers put in and the source (lib/explain/steps.ts). */
import { memo } from 'react';
import type { ExplainStep } from '@/lib/explain/steps';

function WorkedOutInner({ steps }: { steps: readonly ExplainStep[] }) {
  return (
    <section className="worked-out" aria-labelledby="worked-out-heading">
      <h3 id="worked-out-heading">How this was worked out</h3>
      <details>
        <summary>Show each step: its formula, the numbers put in and the source</summary>
        <ol className="steps" data-testid="worked-out">
          {steps.map((step) => (
            <li key={step.id} className="step" data-step={step.id}>
              <p className="step__title">{step.title}</p>
              <dl>
                <div>
                  <dt>Formula</dt>
                  <dd>
                    <code>{step.formula}</code>
                  </dd>
                </div>
                <div>
                  <dt>Numbers put in</dt>
                  <dd>
                    <code>{step.numbers}</code>
                  </dd>
                </div>
                <div>
                  <dt>Gives</dt>
                  <dd>{step.result}</dd>
                </div>
                <div>
                  <dt>Source</dt>
                  <dd>{step.source}</dd>
                </div>
              </dl>
            </li>
          ))}
        </ol>
      </details>
    </section>
  );
}

export const WorkedOut = memo(WorkedOutInner);
