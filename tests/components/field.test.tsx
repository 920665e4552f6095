import { render, screen } from "@testing-library/react";
import { describe, expect, it } from "vitest";
import { SelectField, TextAreaField, TextField } from "@/components/ui/field";

// The text a screen reader reads after a control's name: the elements its aria-describedby names.
function description(control: HTMLElement): string {
  const ids = control.getAttribute("aria-describedby")?.split(/\s+/).filter(Boolean) ?? [];
  return ids.map((id) => document.getElementById(id)?.textContent ?? `(missing #${id})`).join(" ");
}

describe("form fields", () => {
  it("describe a text input by its hint, and by its error once there is one", () => {
    const { rerender } = render(<TextField id="password" label="Password" hint="At least 8 characters" />);
    expect(description(screen.getByLabelText("Password"))).toBe("At least 8 characters");
    rerender(<TextField id="password" label="Password" hint="At least 8 characters" error="Password must be at least 8 characters" />);
    const input = screen.getByLabelText("Password");
    expect(description(input)).toBe("Password must be at least 8 characters");
    expect(input.getAttribute("aria-invalid")).toBe("true");
  });

  it("describe a select by its error", () => {
    render(
      <SelectField id="member-role" label="Role" error="Role must be one of owner, admin, editor, viewer">
        <option value="editor">editor</option>
      </SelectField>,
    );
    const select = screen.getByLabelText("Role");
    expect(description(select)).toBe("Role must be one of owner, admin, editor, viewer");
    expect(select.getAttribute("aria-invalid")).toBe("true");
  });

  it("describe a text area by its error", () => {
    render(<TextAreaField id="kit-notes" label="Notes" error="Notes must be at most 2000 characters" />);
    expect(description(screen.getByLabelText("Notes"))).toBe("Notes must be at most 2000 characters");
  });

  it("leave a control without hint or error undescribed", () => {
    render(<TextField id="kit-name" label="Name" />);
    expect(screen.getByLabelText("Name").hasAttribute("aria-describedby")).toBe(false);
    expect(screen.getByLabelText("Name").getAttribute("aria-invalid")).toBe("false");
  });
});
