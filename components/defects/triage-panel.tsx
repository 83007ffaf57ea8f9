"use client";

import { moveDefectAction, returnToServiceAction } from "@/app/(app)/defects/actions";
import { FormStatus } from "@/components/forms/form-status";
import { SubmitButton } from "@/components/forms/submit-button";
import { useFormAction } from "@/components/forms/use-form-action";
import {
  Card,
  CardBody,
  CardHeader,
  Field,
  Select,
  Textarea,
  buttonClasses,
} from "@/components/ui";
import type { ReactNode } from "react";
import { categoryLabel, type DefectMoveKind } from "@/lib/defects";

type Candidate = { id: string; category: string; description: string; state: string };
type LinkableJob = { id: string; number: number; title: string; state: string };

function MoveForm({
  id,
  version,
  move,
  children,
  label,
}: {
  id: string;
  version: number;
  move: DefectMoveKind;
  children: (errorOf: (field: string) => string | undefined) => ReactNode;
  label: string;
}) {
  const { state, formAction, errorOf } = useFormAction(moveDefectAction);
  return (
    <form action={formAction} aria-label={label} className="flex flex-col gap-3" noValidate>
      <input type="hidden" name="id" value={id} />
      <input type="hidden" name="version" value={version} />
      <input type="hidden" name="move" value={move} />
      {children(errorOf)}
      <FormStatus state={state} testId={`move-${move}-status`} />
    </form>
  );
}

/** The manager's moves on one defect: only those its state allows are offered. */
export function TriagePanel({
  defect,
  moves,
  candidates,
  jobs,
  raiseJobHref,
}: {
  defect: { id: string; version: number; vehicleId: string };
  moves: DefectMoveKind[];
  candidates: Candidate[];
  jobs: LinkableJob[];
  raiseJobHref: string | null;
}) {
  if (moves.length === 0) return null;
  const { id, version } = defect;
  // Closing after a repair (resolved: close is the only move) needs no reason; otherwise it does.
  const closeHint =
    moves.length === 1 ? "Optional after a repair" : "Needed when nothing was repaired";
  return (
    <Card aria-label="Decide">
      <CardHeader
        title="Decide"
        description="What happens to this report next. Each step is recorded with your name."
      />
      <CardBody className="flex flex-col gap-6">
        {moves.includes("triage") && (
          <MoveForm id={id} version={version} move="triage" label="Triage">
            {() => (
              <>
                <p className="text-sm text-muted">
                  You have looked at it and it needs action (a job, or closing with a reason).
                </p>
                <SubmitButton className="self-start">Mark as triaged</SubmitButton>
              </>
            )}
          </MoveForm>
        )}
        {moves.includes("start_repair") && (
          <MoveForm id={id} version={version} move="start_repair" label="Link a repair job">
            {(errorOf) => (
              <>
                <Field
                  label="Repair job"
                  hint="An open job on this vehicle"
                  id="link-job"
                  error={errorOf("jobId")}
                >
                  <Select name="jobId" defaultValue="">
                    <option value="" disabled>
                      {jobs.length === 0 ? "No open job on this vehicle yet" : "Pick the job"}
                    </option>
                    {jobs.map((j) => (
                      <option key={j.id} value={j.id}>
                        Job {j.number} · {j.title} ({j.state.replace("_", " ")})
                      </option>
                    ))}
                  </Select>
                </Field>
                <div className="flex flex-wrap items-center gap-3">
                  <SubmitButton disabled={jobs.length === 0}>Link and start repair</SubmitButton>
                  {raiseJobHref && (
                    <a href={raiseJobHref} className={buttonClasses({ variant: "secondary" })}>
                      Raise a job
                    </a>
                  )}
                </div>
              </>
            )}
          </MoveForm>
        )}
        {moves.includes("resolve") && (
          <MoveForm id={id} version={version} move="resolve" label="Resolve">
            {() => (
              <>
                <p className="text-sm text-muted">
                  The repair is done. The vehicle stays grounded, if it is, until you return it to
                  service.
                </p>
                <SubmitButton className="self-start">Mark as resolved</SubmitButton>
              </>
            )}
          </MoveForm>
        )}
        {moves.includes("merge") && candidates.length > 0 && (
          <MoveForm id={id} version={version} move="merge" label="Merge into another report">
            {(errorOf) => (
              <>
                <Field
                  label="Same fault as"
                  hint="The report kept takes the more urgent severity of the two"
                  id="merge-into"
                  error={errorOf("intoId")}
                >
                  <Select name="intoId" defaultValue="">
                    <option value="" disabled>
                      Pick the report to keep
                    </option>
                    {candidates.map((c) => (
                      <option key={c.id} value={c.id}>
                        {categoryLabel(c.category)}: {c.description.slice(0, 60)} (
                        {c.state.replace("_", " ")})
                      </option>
                    ))}
                  </Select>
                </Field>
                <SubmitButton variant="secondary" className="self-start">
                  Merge
                </SubmitButton>
              </>
            )}
          </MoveForm>
        )}
        {moves.includes("close") && (
          <MoveForm id={id} version={version} move="close" label="Close">
            {(errorOf) => (
              <>
                <Field
                  label="Why close it?"
                  hint={closeHint}
                  id="close-reason"
                  error={errorOf("reason")}
                >
                  <Textarea name="reason" rows={2} />
                </Field>
                <SubmitButton variant="secondary" className="self-start">
                  Close
                </SubmitButton>
              </>
            )}
          </MoveForm>
        )}
      </CardBody>
    </Card>
  );
}

/** Return a grounded vehicle to service: a manager, and a reason. */
export function ReturnToServicePanel({
  vehicleId,
  fleetNumber,
  defectId,
  openStopDefects,
}: {
  vehicleId: string;
  fleetNumber: string;
  defectId: string;
  openStopDefects: number;
}) {
  const { state, formAction, errorOf } = useFormAction(returnToServiceAction);
  return (
    <Card aria-label="Return to service">
      <CardHeader
        title={`${fleetNumber} is grounded`}
        description="It goes back into service only when a manager says why it is safe."
      />
      <CardBody>
        <form
          action={formAction}
          className="flex flex-col gap-3"
          noValidate
          aria-label="Return to service form"
        >
          <input type="hidden" name="id" value={vehicleId} />
          <input type="hidden" name="defectId" value={defectId} />
          {openStopDefects > 0 && (
            <p className="rounded-md border-l-4 border-warn bg-warn-soft px-3 py-2 text-sm font-medium text-warn-ink">
              {openStopDefects === 1 ? "1 stop defect is" : `${openStopDefects} stop defects are`}{" "}
              still open on this vehicle. Resolve or close {openStopDefects === 1 ? "it" : "them"}{" "}
              first unless you are sure.
            </p>
          )}
          <Field
            label="Why is it safe to drive?"
            required
            error={errorOf("reason")}
            id="return-reason"
          >
            <Textarea name="reason" rows={2} />
          </Field>
          <SubmitButton className="self-start">Return to service</SubmitButton>
          <FormStatus state={state} testId="return-status" />
        </form>
      </CardBody>
    </Card>
  );
}
