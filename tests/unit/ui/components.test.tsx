import Link from "next/link";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import {
  Button,
  Caution,
  Checkbox,
  DEFAULT_CAUTION,
  Field,
  FormMessage,
  Input,
  PageHeader,
  Select,
  Spinner,
  StatusPill,
  statusShapeOf,
  statusTones,
  Table,
  Td,
  Th,
  Textarea,
} from "@/components/ui";
import { attr, onlyTag, openTags, textOf } from "./html";

const render = renderToStaticMarkup;

describe("Field", () => {
  it("wires the hint and the error to the control with aria-describedby and sets aria-invalid", () => {
    const html = render(
      <Field
        id="front"
        label="Front axle (kg)"
        hint="As printed on the ticket"
        error="Enter a mass above zero"
        required
      >
        <Input inputMode="decimal" />
      </Field>,
    );
    const input = onlyTag(html, "input");
    expect(attr(input, "id")).toBe("front");
    expect(attr(input, "aria-describedby")).toBe("front-hint front-error");
    expect(attr(input, "aria-invalid")).toBe("true");
    expect(input).toMatch(/\srequired=""/);
    // The ids it points at exist and hold the hint and the error.
    const error = openTags(html, "p").find((t) => attr(t, "id") === "front-error");
    expect(error).toBeDefined();
    expect(html).toMatch(/id="front-error"[^>]*>.*Enter a mass above zero/);
    expect(html).toMatch(/id="front-hint"[^>]*>As printed on the ticket</);
    // The label names the control.
    expect(attr(onlyTag(html, "label"), "for")).toBe("front");
    expect(textOf(html)).toContain("Front axle (kg)");
  });

  it("leaves aria-invalid off and describes by the hint only when there is no error", () => {
    const html = render(
      <Field id="rear" label="Rear axle (kg)" hint="From the ticket">
        <Input />
      </Field>,
    );
    const input = onlyTag(html, "input");
    expect(attr(input, "aria-describedby")).toBe("rear-hint");
    expect(attr(input, "aria-invalid")).toBeUndefined();
    expect(html).not.toContain("rear-error");
  });

  it("keeps a describedby the control already had and works with select, textarea and a render function", () => {
    const sel = onlyTag(
      render(
        <Field id="depot" label="Depot" error="Pick a depot">
          <Select aria-describedby="depot-note">
            <option>Kalinga Creek</option>
          </Select>
        </Field>,
      ),
      "select",
    );
    expect(attr(sel, "aria-describedby")).toBe("depot-note depot-error");
    expect(attr(sel, "aria-invalid")).toBe("true");

    const ta = onlyTag(
      render(
        <Field id="notes" label="Notes" hint="What was on board">
          <Textarea />
        </Field>,
      ),
      "textarea",
    );
    expect(attr(ta, "aria-describedby")).toBe("notes-hint");

    const fn = render(
      <Field id="vin" label="VIN" error="17 characters" required>
        {(control) => <input {...control} className="x" />}
      </Field>,
    );
    const input = onlyTag(fn, "input");
    expect(attr(input, "aria-describedby")).toBe("vin-error");
    expect(attr(input, "aria-invalid")).toBe("true");
    expect(input).toMatch(/\srequired=""/);
  });

  it("makes an id when none is given, and the label still points at the control", () => {
    const html = render(
      <Field label="Odometer (km)">
        <Input />
      </Field>,
    );
    const id = attr(onlyTag(html, "input"), "id");
    expect(id).toBeTruthy();
    expect(attr(onlyTag(html, "label"), "for")).toBe(id);
  });
});

describe("StatusPill", () => {
  it("always contains its word, and each tone has its own shape", () => {
    const shapes = new Set<string>();
    for (const tone of statusTones) {
      const html = render(<StatusPill tone={tone}>Word-{tone}</StatusPill>);
      expect(textOf(html)).toBe(`Word-${tone}`);
      const svg = onlyTag(html, "svg");
      expect(attr(svg, "aria-hidden")).toBe("true");
      expect(attr(svg, "data-shape")).toBe(statusShapeOf[tone]);
      shapes.add(statusShapeOf[tone]);
    }
    // Colour-blind safe: no two tones share a shape.
    expect(shapes.size).toBe(statusTones.length);
  });
});

describe("Button", () => {
  it("sets aria-busy, shows a spinner and stops presses while loading", () => {
    const html = render(<Button loading>Save</Button>);
    const button = onlyTag(html, "button");
    expect(attr(button, "aria-busy")).toBe("true");
    expect(button).toMatch(/\sdisabled=""/);
    expect(html).toContain("animate-spin");
    expect(textOf(html)).toBe("Save");
  });

  it("has no aria-busy when idle, and lg is at least 48 px (min-h-12)", () => {
    const button = onlyTag(render(<Button size="lg">Report defect</Button>), "button");
    expect(attr(button, "aria-busy")).toBeUndefined();
    expect(button).not.toMatch(/\sdisabled=""/);
    expect(attr(button, "class")).toContain("min-h-12");
  });

  it("renders its child instead of a button with asChild", () => {
    const html = render(
      <Button asChild variant="secondary" loading>
        <Link href="/vehicles/new">Add vehicle</Link>
      </Button>,
    );
    expect(openTags(html, "button")).toHaveLength(0);
    const a = onlyTag(html, "a");
    expect(attr(a, "href")).toBe("/vehicles/new");
    expect(attr(a, "aria-busy")).toBe("true");
    expect(attr(a, "aria-disabled")).toBe("true");
    expect(attr(a, "class")).toContain("border-line-strong");
    expect(textOf(html)).toBe("Add vehicle");
  });
});

describe("Caution", () => {
  it("is a note with the default planning-aid text", () => {
    const html = render(<Caution />);
    const note = onlyTag(html, "div");
    expect(attr(note, "role")).toBe("note");
    expect(attr(note, "aria-label")).toBe("Caution");
    expect(textOf(html)).toBe(DEFAULT_CAUTION);
    expect(DEFAULT_CAUTION).toContain("certified weighbridge");
    expect(DEFAULT_CAUTION).toContain("authorised vehicle engineer");
  });

  it("takes its own short text", () => {
    const text = "Follow the equipment maker's instructions and local wiring rules.";
    expect(textOf(render(<Caution text={text} />))).toBe(text);
  });
});

describe("FormMessage", () => {
  it("is a named polite live region with the given test id", () => {
    const html = render(
      <FormMessage tone="error" data-testid="ticket-message">
        Two fields need fixing.
      </FormMessage>,
    );
    const region = openTags(html, "div")[0] as string;
    expect(attr(region, "aria-live")).toBe("polite");
    expect(attr(region, "role")).toBe("status");
    expect(attr(region, "aria-label")).toBe("Form error");
    expect(attr(region, "data-testid")).toBe("ticket-message");
    expect(textOf(html)).toBe("Two fields need fixing.");
  });

  it("stays in the page, empty, when there is nothing to say", () => {
    const html = render(
      <FormMessage tone="success" label="Import result" data-testid="import-message" />,
    );
    const region = onlyTag(html, "div");
    expect(attr(region, "aria-live")).toBe("polite");
    expect(attr(region, "aria-label")).toBe("Import result");
    expect(textOf(html)).toBe("");
  });
});

describe("Table cells", () => {
  it("puts aria-sort only on the sorted column and links the sort control", () => {
    const html = render(
      <table>
        <thead>
          <tr>
            <Th sort="ascending" sortHref="?sort=fleet&amp;dir=desc">
              Fleet no.
            </Th>
            <Th sort="none" numeric sortHref="?sort=payload">
              Payload left
            </Th>
            <Th>Depot</Th>
          </tr>
        </thead>
      </table>,
    );
    const ths = openTags(html, "th");
    expect(ths.map((t) => attr(t, "aria-sort"))).toEqual(["ascending", undefined, undefined]);
    expect(ths.map((t) => attr(t, "scope"))).toEqual(["col", "col", "col"]);
    expect(attr(ths[1] as string, "class")).toContain("text-right");
    expect(openTags(html, "a")).toHaveLength(2);
    // The sort indicator is drawn for both sortable columns, showing their state.
    expect(openTags(html, "svg").map((t) => attr(t, "data-sort"))).toEqual(["ascending", "none"]);
  });

  it("right-aligns numbers in tabular figures with the unit after them", () => {
    const html = render(
      <table>
        <tbody>
          <tr>
            <Td numeric unit="kg">
              2,150
            </Td>
          </tr>
        </tbody>
      </table>,
    );
    const td = onlyTag(html, "td");
    expect(attr(td, "class")).toMatch(/text-right/);
    expect(attr(td, "class")).toMatch(/tabular-nums/);
    expect(textOf(html)).toBe("2,150\u00a0kg");
  });

  it("makes a labelled table's scroller a focusable region", () => {
    const wrapper = openTags(
      render(
        <Table label="Vehicles">
          <tbody />
        </Table>,
      ),
      "div",
    )[0] as string;
    expect(attr(wrapper, "role")).toBe("region");
    expect(attr(wrapper, "aria-label")).toBe("Vehicles");
    expect(attr(wrapper, "tabindex")).toBe("0");
  });
});

describe("other primitives", () => {
  it("Checkbox has its label tied to the box and its hint described", () => {
    const html = render(
      <Checkbox id="touring" label="Loaded for touring" hint="Water and fuel on board" />,
    );
    const input = onlyTag(html, "input");
    expect(attr(input, "type")).toBe("checkbox");
    expect(attr(onlyTag(html, "label"), "for")).toBe("touring");
    expect(attr(input, "aria-describedby")).toBe("touring-hint");
  });

  it("Spinner with a label is a status; without one it is hidden", () => {
    const labelled = render(<Spinner label="Loading vehicles" />);
    expect(attr(openTags(labelled, "span")[0] as string, "role")).toBe("status");
    expect(textOf(labelled)).toBe("Loading vehicles");
    expect(attr(onlyTag(render(<Spinner />), "svg"), "aria-hidden")).toBe("true");
  });

  it("PageHeader has one h1 and shows the page's question", () => {
    const html = render(
      <PageHeader
        title="Vehicle register"
        question="Which vehicles can go out today?"
        actions={<Button>Add vehicle</Button>}
      />,
    );
    expect(openTags(html, "h1")).toHaveLength(1);
    expect(textOf(html)).toContain("Which vehicles can go out today?");
    expect(openTags(html, "button")).toHaveLength(1);
  });
});
