"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import Link from "next/link";
import { useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { QrReader } from "@/components/ui/qr-reader";
import { ApiError, apiFetch } from "@/lib/api-client";
import { containerCodeFromScan, scannedKind } from "@/lib/domain/service";

export interface IssuePanelProps {
  greases: {
    id: number;
    code: string;
    name: string;
    packs: { id: number; kind: string; netMassGrams: number }[];
  }[];
  locations: { value: string; label: string }[];
  recipients: { id: string; name: string; role: string }[];
}

interface IssueLot {
  labelCode: string;
  lotNumber: string;
  location: string;
  qualifiedCode: string;
  onHand: number;
  expiresOn: string | null;
  expired: boolean;
  daysToExpiry: number | null;
  suggested: boolean;
}

interface LabelAnswer {
  labelCode: string;
  lotNumber: string;
  grease: { id: number; name: string };
  pack: { id: number };
  locations: { code: string; qualifiedCode: string; onHand: number }[];
  expired: boolean;
}

interface IssueAnswer {
  issued: { lotNumber: string; labelCode: string; quantity: number; location: string }[];
  quantity: number;
  warnings: string[];
}

/**
 * The clerk hands out containers: scan a label or pick the grease; the lots are listed first-expiring first with
 * the one to take marked; issuing goes through the public API with an Idempotency-Key kept across retries.
 */
export function IssuePanel({ greases, locations, recipients }: IssuePanelProps) {
  const queryClient = useQueryClient();
  const [greaseId, setGreaseId] = useState("");
  const [packId, setPackId] = useState("");
  const [location, setLocation] = useState(locations[0]?.value ?? "");
  const [lotLabel, setLotLabel] = useState<string | null>(null);
  const [quantity, setQuantity] = useState("1");
  const [recipient, setRecipient] = useState("");
  const [scanProblem, setScanProblem] = useState<string | null>(null);
  const keyRef = useRef<string | null>(null);
  const grease = greases.find((g) => String(g.id) === greaseId);

  const lots = useQuery({
    queryKey: ["stock-lots", greaseId, packId, location],
    queryFn: () =>
      apiFetch<{ items: IssueLot[] }>(
        `/api/v1/stock/lots?${new URLSearchParams({ greaseId, ...(packId ? { packId } : {}), ...(location ? { location } : {}) })}`,
      ),
    enabled: Boolean(greaseId),
  });

  async function readLabel(code: string) {
    setScanProblem(null);
    try {
      const label = await apiFetch<LabelAnswer>(`/api/v1/stock/labels/${code}`);
      setGreaseId(String(label.grease.id));
      setPackId(String(label.pack.id));
      const here = label.locations.find(
        (l) => l.onHand > 0 && locations.some((o) => o.value === l.qualifiedCode || o.value === l.code),
      );
      if (here)
        setLocation(locations.some((o) => o.value === here.qualifiedCode) ? here.qualifiedCode : here.code);
      setLotLabel(label.labelCode);
      if (label.expired)
        setScanProblem(
          `Lot ${label.lotNumber} has expired: it cannot be issued. Take it aside for testing or scrap.`,
        );
    } catch (error) {
      setScanProblem(
        error instanceof ApiError && error.status === 404
          ? `No container with label ${code} on your sites.`
          : "The label could not be looked up; try again.",
      );
    }
  }

  const issue = useMutation({
    mutationFn: () => {
      keyRef.current ??= crypto.randomUUID();
      return apiFetch<IssueAnswer>("/api/v1/stock/issues", {
        method: "POST",
        json: {
          greaseId: Number(greaseId),
          packId: Number(packId),
          quantity: Number(quantity),
          ...(location ? { location } : {}),
          ...(lotLabel ? { lotLabel } : {}),
          ...(recipient ? { issuedToUserId: recipient } : {}),
        },
        headers: { "Idempotency-Key": keyRef.current },
      });
    },
    // A lost connection is retried with the same key; any answer from the server ends the key.
    retry: (count, error) => !(error instanceof ApiError) && count < 3,
    onSettled: (_data, error) => {
      if (!error || error instanceof ApiError) keyRef.current = null;
      void queryClient.invalidateQueries({ queryKey: ["stock-lots"] });
    },
  });
  const fields = issue.error instanceof ApiError ? issue.error.body?.error.fields : undefined;
  const items = lots.data?.items ?? [];

  return (
    <div className="grid gap-6 lg:grid-cols-2">
      <section aria-label="Scan a container label" className="space-y-3">
        <h2 className="text-lg font-bold">Scan a container</h2>
        <QrReader
          idPrefix="issue"
          cameraLabel="Scan a label with the camera"
          photoLabel="Or scan a photo of the label"
          typeLabel="Or type the label code"
          typeButton="Look up"
          noCodeMessage="No code was found in this photo. Try again in good light."
          large={false}
          onText={(text) => {
            if (scannedKind(text) === "point") return "That is a lube-point tag, not a container label.";
            const code = containerCodeFromScan(text);
            if (!code) return "This is not a Greaseledger container label.";
            void readLabel(code);
            return null;
          }}
        />
        {scanProblem ? <Notice tone="caution">{scanProblem}</Notice> : null}
      </section>

      <form
        className="space-y-4"
        aria-label="Issue containers"
        onSubmit={(e) => {
          e.preventDefault();
          issue.mutate();
        }}
      >
        <h2 className="text-lg font-bold">What goes out</h2>
        {issue.isSuccess ? (
          <Notice tone="success" title="Issued">
            {issue.data.issued.map((i) => `${i.quantity} from lot ${i.lotNumber} (${i.location})`).join(", ")}
            .
            {issue.data.warnings.map((w) => (
              <span key={w} className="mt-1 block font-bold">
                ⚠ {w}
              </span>
            ))}
          </Notice>
        ) : null}
        {issue.isError ? (
          <Notice tone="danger" title="Not issued">
            {issue.error.message}
            {fields ? <span className="block">{Object.values(fields).flat().join(" ")}</span> : null}
          </Notice>
        ) : null}
        <div className="grid gap-3 sm:grid-cols-2">
          <div className="flex flex-col gap-1">
            <label htmlFor="issue-grease" className="text-sm font-bold">
              Grease
            </label>
            <select
              id="issue-grease"
              className={inputClasses}
              value={greaseId}
              onChange={(e) => {
                setGreaseId(e.target.value);
                const g = greases.find((x) => String(x.id) === e.target.value);
                setPackId(g?.packs[0] ? String(g.packs[0].id) : "");
                setLotLabel(null);
              }}
            >
              <option value="">Choose the grease…</option>
              {greases.map((g) => (
                <option key={g.id} value={g.id}>
                  {g.name} ({g.code})
                </option>
              ))}
            </select>
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor="issue-pack" className="text-sm font-bold">
              Pack
            </label>
            <select
              id="issue-pack"
              className={inputClasses}
              value={packId}
              onChange={(e) => {
                setPackId(e.target.value);
                setLotLabel(null);
              }}
            >
              {grease ? null : <option value="">Choose the grease first</option>}
              {grease?.packs.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.kind} {p.netMassGrams} g
                </option>
              ))}
            </select>
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor="issue-location" className="text-sm font-bold">
              From
            </label>
            <select
              id="issue-location"
              className={inputClasses}
              value={location}
              onChange={(e) => {
                setLocation(e.target.value);
                setLotLabel(null);
              }}
            >
              {locations.map((l) => (
                <option key={l.value} value={l.value}>
                  {l.label}
                </option>
              ))}
            </select>
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor="issue-quantity" className="text-sm font-bold">
              Containers
            </label>
            <input
              id="issue-quantity"
              inputMode="numeric"
              className={inputClasses}
              value={quantity}
              onChange={(e) => setQuantity(e.target.value)}
            />
          </div>
          <div className="flex flex-col gap-1 sm:col-span-2">
            <label htmlFor="issue-to" className="text-sm font-bold">
              Issued to
            </label>
            <select
              id="issue-to"
              className={inputClasses}
              value={recipient}
              onChange={(e) => setRecipient(e.target.value)}
            >
              <option value="">Not recorded</option>
              {recipients.map((r) => (
                <option key={r.id} value={r.id}>
                  {r.name} ({r.role === "lead" ? "lead" : "technician"})
                </option>
              ))}
            </select>
          </div>
        </div>

        {greaseId ? (
          <fieldset className="space-y-2">
            <legend className="text-sm font-bold">Lot</legend>
            {lots.isPending ? <p className="text-sm text-ink-soft">Loading the lots…</p> : null}
            {lots.isError ? (
              <Notice tone="danger">The lots could not be loaded: {lots.error.message}</Notice>
            ) : null}
            {lots.isSuccess && items.length === 0 ? (
              <Notice tone="caution">
                None of this grease and pack is in stock here. Receive a delivery, or choose another location.
              </Notice>
            ) : null}
            {items.length ? (
              <>
                <label className="flex min-h-10 items-center gap-2 text-sm">
                  <input
                    type="radio"
                    name="lot"
                    className="h-5 w-5"
                    checked={lotLabel === null}
                    onChange={() => setLotLabel(null)}
                  />
                  The lots that expire first (automatic)
                </label>
                <ul
                  className="divide-y divide-line rounded-md border border-line text-sm"
                  data-testid="issue-lots"
                >
                  {items.map((l) => (
                    <li key={`${l.labelCode}-${l.location}`} className="flex items-center gap-2 p-2">
                      <input
                        type="radio"
                        name="lot"
                        id={`lot-${l.labelCode}-${l.location}`}
                        className="h-5 w-5"
                        disabled={l.expired}
                        checked={lotLabel === l.labelCode}
                        onChange={() => setLotLabel(l.labelCode)}
                      />
                      <label htmlFor={`lot-${l.labelCode}-${l.location}`} className="flex-1">
                        <span className="font-bold">Lot {l.lotNumber}</span> ·{" "}
                        <span className="font-mono">{l.labelCode}</span> · {l.onHand} at {l.location} ·{" "}
                        {l.expiresOn ? `use by ${l.expiresOn}` : "no expiry date"}
                        {l.suggested ? (
                          <span className="ml-2 font-bold text-good">★ expires first: take this one</span>
                        ) : null}
                        {l.expired ? (
                          <span className="ml-2 font-bold text-bad">✖ expired — do not issue</span>
                        ) : null}
                      </label>
                      <Link href={`/stock/lots/${l.labelCode}`} className="text-2xs">
                        lot
                      </Link>
                    </li>
                  ))}
                </ul>
              </>
            ) : null}
          </fieldset>
        ) : null}
        <Button type="submit" size="lg" disabled={!greaseId || !packId || !quantity || issue.isPending}>
          {issue.isPending ? "Issuing…" : "Issue"}
        </Button>
      </form>
    </div>
  );
}
