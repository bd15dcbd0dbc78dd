"use client";
import { useState } from "react";
import { Badge, BADGE_TONES, type BadgeTone } from "./badge";
import { Button } from "./button";
import { Card } from "./card";
import { Checkbox, Radio } from "./choice";
import { Dialog } from "./dialog";
import { Field, SelectField, TextAreaField } from "./field";
import { Notice } from "./notice";
import { Panel } from "./panel";
import { PALETTE } from "./palette";
import { Progress } from "./progress";
import { Tabs } from "./tabs";
import { useToast } from "./toast";
import { EmptyState, Spinner } from "./empty-state";
import { tableClass, tableShell, headClass, rowClass } from "./data-table";

// White or dark ink on a swatch, whichever reads better (WCAG relative luminance).
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}
const SWATCH_TEXT = (hex: string) => (1.05 / (luminance(hex) + 0.05) >= (luminance(hex) + 0.05) / (luminance(PALETTE.humus[900]) + 0.05) ? "text-white" : "text-humus-900");

export function StyleGuide() {
  const [open, setOpen] = useState(false);
  const [upload, setUpload] = useState(40);
  const toast = useToast();
  return (
    <div className="flex flex-col gap-8">
      <Panel id="sg-palette" title="Palette">
        <div className="flex flex-col gap-3">
          {(Object.keys(PALETTE) as (keyof typeof PALETTE)[]).map((family) => (
            <div key={family} className="flex flex-wrap gap-1">
              <span className="w-16 font-semibold">{family}</span>
              {Object.entries(PALETTE[family]).map(([shade, hex]) => (
                <span key={shade} className={`rounded px-2 py-1 text-xs ${SWATCH_TEXT(hex)}`} style={{ background: hex }}>
                  {shade} {hex}
                </span>
              ))}
            </div>
          ))}
        </div>
      </Panel>
      <Panel id="sg-buttons" title="Buttons">
        <div className="flex flex-wrap gap-3">
          <Button>Primary</Button>
          <Button variant="secondary">Secondary</Button>
          <Button variant="danger">Suspend account</Button>
          <Button variant="quiet">Quiet</Button>
          <Button disabled>Disabled</Button>
        </div>
      </Panel>
      <Panel id="sg-fields" title="Fields, selects, checkboxes, radios, ranges">
        <div className="grid gap-4 md:grid-cols-2">
          <Field label="Bed length" name="sg-length" hint="In metres" defaultValue="2.4" />
          <Field label="With an error" name="sg-error" error="Give a length between 0.3 and 50 m" defaultValue="70" />
          <SelectField label="Material" name="sg-material" defaultValue="leaves">
            <option value="leaves">Leaves</option>
            <option value="straw">Straw</option>
          </SelectField>
          <TextAreaField label="Note to the supplier" name="sg-note" rows={2} />
          <fieldset>
            <legend className="font-medium">Checkboxes</legend>
            <Checkbox label="Free only" defaultChecked />
            <Checkbox label="I can collect at weekends" hint="Saturday and Sunday" />
            <Checkbox label="Disabled" disabled />
          </fieldset>
          <fieldset>
            <legend className="font-medium">Radios</legend>
            <Radio name="sg-radio" label="Collect" defaultChecked />
            <Radio name="sg-radio" label="Post" />
          </fieldset>
          <label className="flex flex-col gap-1 font-medium">
            Range ({upload} %)
            <input type="range" min={0} max={100} value={upload} onChange={(e) => setUpload(Number(e.target.value))} />
          </label>
          <div className="flex flex-col gap-3">
            <Progress value={upload} label="Uploading photo" />
            <Progress value={null} label="Waiting for the server" />
            <progress value={upload} max={100} aria-label="Native progress" className="w-full" />
          </div>
        </div>
      </Panel>
      <Panel id="sg-badges" title="Badges and notices">
        <div className="flex flex-wrap gap-2">
          {(Object.keys(BADGE_TONES) as BadgeTone[]).map((t) => (
            <Badge key={t} tone={t}>
              {t}
            </Badge>
          ))}
        </div>
        <div className="mt-4 grid gap-3 md:grid-cols-3">
          <Notice>Information</Notice>
          <Notice tone="caution">Straw can carry weedkiller residue: ask, and test with bean seeds.</Notice>
          <Notice tone="error">Something went wrong.</Notice>
        </div>
      </Panel>
      <Panel id="sg-cards" title="Cards, tables, disclosure">
        <div className="grid gap-4 md:grid-cols-3">
          <Card>Plain card</Card>
          <Card tone="soft">Soft card</Card>
          <Card tone="picked">Picked card</Card>
        </div>
        <div className={`${tableShell} mt-4`}>
          <table className={tableClass}>
            <thead className={headClass}>
              <tr>
                <th scope="col" className="p-3">Material</th>
                <th scope="col" className="p-3">Amount</th>
              </tr>
            </thead>
            <tbody>
              <tr className={rowClass}>
                <td className="p-3">Leaves</td>
                <td className="p-3">12 bags</td>
              </tr>
            </tbody>
          </table>
        </div>
        <details className="mt-4 rounded-lg bg-humus-50 p-3 ring-1 ring-humus-200">
          <summary className="font-medium">A disclosure with its chevron</summary>
          <p className="mt-2">Opened.</p>
        </details>
      </Panel>
      <Panel id="sg-tabs" title="Tabs, dialog, toast, empty and loading">
        <Tabs
          label="Example tabs"
          tabs={[
            { id: "one", label: "What", content: <p>First panel.</p> },
            { id: "two", label: "How much", content: <p>Second panel.</p> },
          ]}
        />
        <div className="mt-4 flex flex-wrap gap-3">
          <Button variant="secondary" onClick={() => setOpen(true)}>
            Open a dialog
          </Button>
          <Button variant="secondary" onClick={() => toast("Saved")}>
            Show a toast
          </Button>
          <Spinner label="Loading" />
        </div>
        <Dialog
          open={open}
          onClose={() => setOpen(false)}
          title="Hide this listing?"
          footer={
            <>
              <Button variant="secondary" onClick={() => setOpen(false)}>
                Keep it
              </Button>
              <Button variant="danger" onClick={() => setOpen(false)}>
                Hide it
              </Button>
            </>
          }
        >
          Hidden listings no longer show in browse.
        </Dialog>
        <div className="mt-4">
          <EmptyState title="Nothing here yet">An empty state.</EmptyState>
        </div>
      </Panel>
    </div>
  );
}
