import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { Link, useNavigate, useParams } from "react-router";
import { Breadcrumb } from "../components/Breadcrumb";
import { Notice } from "../components/Notice";
import { QueryState } from "../components/QueryState";
import { ApprovalDialog } from "../components/ApprovalDialog";
import { VersionSidebar } from "../components/VersionSidebar";
import { StatusBadge } from "../components/StatusBadge";
import { VersionActions } from "../components/VersionActions";
import { useApproveRateModelMutation } from "../features/rateModels/mutations";
import { useSession } from "../features/session/useSession";
import { rateModelVersionQueryOptions, rateModelVersionsQueryOptions } from "../features/rateModels/queries";
import { RateModelForm } from "../features/rateModels/RateModelForm";
import { contentToForm } from "../features/rateModels/rateModelFormValues";
import { RateModelSummary } from "../features/rateModels/RateModelSummary";

type Mode = "view" | "edit" | "next";

const versionHref = (id: string) => `/rate-models/versions/${id}`;
type Message = { tone: "success" | "error"; text: string };

/** One rate-model version: its content and signatures; edit a draft, approve it, or start the next version. */
export default function RateModelVersion() {
  const { versionId = "" } = useParams();
  // A fresh screen per version, so messages and open forms do not carry over.
  return <VersionScreen key={versionId} versionId={versionId} />;
}

function VersionScreen({ versionId }: { versionId: string }) {
  const navigate = useNavigate();
  const query = useQuery(rateModelVersionQueryOptions(versionId));
  const modelId = query.data?.modelId;
  const siblings = useQuery({ ...rateModelVersionsQueryOptions(modelId ?? ""), enabled: Boolean(modelId) });
  const approve = useApproveRateModelMutation();
  const { user } = useSession();
  const [mode, setMode] = useState<Mode>("view");
  const [signing, setSigning] = useState(false);
  const [message, setMessage] = useState<Message | null>(null);
  const version = query.data;

  const others = siblings.data ?? [];
  const openDraft = others.find((v) => v.status === "draft" && v.id !== versionId);
  const nextNumber = Math.max(0, ...others.map((v) => v.version)) + 1;
  const subject = version ? `Rate model ${version.code} version ${version.version}` : "";

  const show = (next: Mode) => {
    setMessage(null);
    setMode(next);
  };

  return (
    <div className="flex flex-col gap-6">
      <Breadcrumb crumbs={[{ to: "/rate-models", label: "Rate models" }, { label: version ? `${version.code} version ${version.version}` : "Version" }]} />
      <QueryState isPending={query.isPending} error={query.error} onRetry={() => void query.refetch()} what="the rate-model version">
        {version && (
          <>
            <div className="flex max-w-3xl flex-col gap-2">
              <h1 className="flex flex-wrap items-center gap-3 text-3xl font-bold">
                {version.code} version {version.version} <StatusBadge status={version.status} />
              </h1>
              <p className="text-ink-800">{version.title}</p>
            </div>
            <div aria-live="polite">{message && <Notice tone={message.tone}>{message.text}</Notice>}</div>
            {mode === "view" && (
              <VersionActions
                version={version}
                openDraftHref={openDraft ? versionHref(openDraft.id) : undefined}
                nextNumber={nextNumber}
                compareHref={others.length > 1 ? `/rate-models/${version.modelId}/compare?right=${version.id}` : undefined}
                onEdit={() => show("edit")}
                onNext={() => show("next")}
                onApprove={() => {
                  setMessage(null);
                  setSigning(true);
                }}
              />
            )}
            {mode === "view" && user?.roles.includes("engineer") && (
              <p>
                <Link to={`/rate-models/versions/${version.id}/update`} className="inline-flex min-h-11 items-center font-semibold">
                  Propose an update from released batches
                </Link>
              </p>
            )}
            {mode !== "view" && (
              <Notice>
                {mode === "edit"
                  ? `You are changing draft version ${version.version} (revision ${version.revision}). The change is kept in the audit trail with your reason.`
                  : `You are drafting version ${nextNumber}, starting from the values of version ${version.version}. Nothing is saved until you save the draft.`}
              </Notice>
            )}
            {mode === "edit" && (
              <RateModelForm
                key={`edit-${version.revision}`}
                mode="edit"
                draft={version}
                initial={contentToForm(version.content)}
                submitLabel="Save changes to the draft"
                onCancel={() => show("view")}
                onSaved={(saved) => {
                  setMode("view");
                  setMessage({ tone: "success", text: `The draft was saved (revision ${saved.revision}).` });
                }}
              />
            )}
            {mode === "next" && (
              <RateModelForm
                mode="draft"
                modelId={version.modelId}
                initial={contentToForm(version.content)}
                submitLabel={`Save draft version ${nextNumber}`}
                onCancel={() => show("view")}
                onSaved={(saved) => {
                  setMode("view");
                  navigate(`/rate-models/versions/${saved.id}`);
                }}
              />
            )}
            {mode === "view" && (
              <div className="grid items-start gap-6 xl:grid-cols-[3fr_2fr]">
                <RateModelSummary version={version} />
                <VersionSidebar idPrefix="rm" version={version} versions={others} hrefFor={versionHref} />
              </div>
            )}
            <ApprovalDialog
              open={signing}
              subject={subject}
              approve={(signature) => approve.mutateAsync({ id: version.id, ...signature })}
              onClose={() => setSigning(false)}
              onOutcome={setMessage}
            />
          </>
        )}
      </QueryState>
    </div>
  );
}
