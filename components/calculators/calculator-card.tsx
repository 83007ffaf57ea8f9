"use client";

import type { FormEvent, ReactNode } from "react";
import { Button, Card, CardBody, CardHeader } from "@/components/ui";
import type { CalcError } from "./api";
import { CalcFormMessage } from "./parts";

/**
 * The frame every calculator shares: a card with its title and purpose, the form (its fields are
 * the children), the overall message for what the fields cannot show, the submit button, and the
 * result once the API has answered.
 */
export function CalculatorCard<TResult>({
  id,
  title,
  description,
  calc,
  shown,
  submitLabel,
  onSubmit,
  result,
  children,
}: {
  /** The card's anchor on the calculators page. */
  id: string;
  /** The card's title, also the form's accessible name. */
  title: string;
  description: string;
  calc: { pending: boolean; error: CalcError | null; result: TResult | undefined };
  /** Whether the form shows a field's error beside it (others go into the overall message). */
  shown: (field: string) => boolean;
  submitLabel: string;
  onSubmit: () => void;
  result: (result: TResult) => ReactNode;
  children: ReactNode;
}) {
  function submit(event: FormEvent) {
    event.preventDefault();
    onSubmit();
  }

  return (
    <Card id={id}>
      <CardHeader title={title} description={description} />
      <CardBody>
        <form onSubmit={submit} noValidate className="flex flex-col gap-5" aria-label={title}>
          {children}
          <CalcFormMessage error={calc.error} shown={shown} label={`${title} form message`} />
          <div>
            <Button type="submit" loading={calc.pending}>
              {submitLabel}
            </Button>
          </div>
        </form>
        {calc.result !== undefined && <div className="mt-5">{result(calc.result)}</div>}
      </CardBody>
    </Card>
  );
}
