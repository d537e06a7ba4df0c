import { XMLParser } from "fast-xml-parser";
import { Euler, Matrix4, Vector3 } from "three";
import { describe, expect, it } from "vitest";
import { forwardLeg, importUrdf, parseRobot, solveLeg, type Robot, type Vec3 } from "../../app/kinematics";
import { fixtureText } from "../support/robots";
import { seededRandom } from "./support/prng";
import { distanceMm } from "./support/reference-fk";

const urdf = fixtureText("test-crab.urdf");
const twinJson = JSON.parse(fixtureText("test-crab.json"));

/** A URDF <joint> as fast-xml-parser reads it: attributes as text; a fixed joint has no axis or limits. */
type UrdfJoint = {
  name: string;
  type: string;
  origin: { xyz: string; rpy: string };
  axis?: { xyz: string };
  limit?: { lower: string; upper: string };
};

function imported(xml = urdf): Robot {
  const result = importUrdf(xml, { standHeightMm: 80 });
  if (!result.ok) throw new Error(JSON.stringify(result.issues));
  return result.robot;
}

function refusal(xml: string) {
  const result = importUrdf(xml);
  if (result.ok) throw new Error("expected the URDF to be refused, it imported");
  return result.issues;
}

// Replaces one attribute inside the named joint's line of the fixture (one joint per line).
function editJoint(jointName: string, edit: (line: string) => string, xml = urdf): string {
  const lines = xml.split("\n");
  const index = lines.findIndex((line) => line.includes(`<joint name="${jointName}"`));
  if (index < 0) throw new Error(`no joint ${jointName} in the fixture`);
  lines[index] = edit(lines[index]);
  return lines.join("\n");
}

describe("importUrdf (URDF XML specification: joint origin xyz/rpy in m/rad, axis, limit lower/upper in rad)", () => {
  it("imports the invented test robot as its hand-written JSON twin", () => {
    const twin = parseRobot(twinJson);
    expect(twin.ok ? [] : twin.issues).toEqual([]);
    expect(imported()).toEqual(twin.ok ? twin.robot : undefined);
  });

  it("gives the same solveLeg angles as the twin on 2000 seeded targets", () => {
    const robot = imported();
    const twin = parseRobot(twinJson);
    if (!twin.ok) throw new Error("twin does not parse");
    const random = seededRandom(11);
    let worstDeg = 0;
    for (let sample = 0; sample < 2000; sample += 1) {
      const leg = robot.legs[sample % robot.legs.length];
      const target: Vec3 = [leg.mount.x + random.between(-150, 150), leg.mount.y + random.between(-150, 150), random.between(-150, 40)];
      const a = solveLeg(robot, leg.id, target).angles;
      const b = solveLeg(twin.robot, leg.id, target).angles;
      worstDeg = Math.max(worstDeg, Math.abs(a.coxa - b.coxa), Math.abs(a.femur - b.femur), Math.abs(a.tibia - b.tibia));
    }
    expect(worstDeg, "largest angle difference (°)").toBeLessThan(1e-9);
  });

  it("maps joint angles so that forwardLeg matches the URDF chain composed with three.js Matrix4 (reference library)", () => {
    // The URDF chain read straight from the XML: T = Trans(xyz)·Rz·Ry·Rx(rpy)·Rot(axis, q) per joint.
    const document = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: "" }).parse(urdf);
    const joints: UrdfJoint[] = document.robot.joint;
    const byName = new Map(joints.map((joint) => [joint.name, joint]));
    const numbers = (text: string) => text.split(/\s+/).map(Number) as [number, number, number];
    const jointNamed = (name: string) => {
      const joint = byName.get(name);
      if (!joint) throw new Error(`the URDF has no joint ${name}`);
      return joint;
    };
    const axisOf = (joint: UrdfJoint) => {
      if (!joint.axis) throw new Error(`joint ${joint.name} has no axis`);
      return numbers(joint.axis.xyz);
    };
    const jointMatrix = (joint: UrdfJoint, q: number) => {
      const [x, y, z] = numbers(joint.origin.xyz);
      const [roll, pitch, yaw] = numbers(joint.origin.rpy);
      const matrix = new Matrix4()
        .makeTranslation(x * 1000, y * 1000, z * 1000)
        .multiply(new Matrix4().makeRotationFromEuler(new Euler(roll, pitch, yaw, "ZYX")));
      if (joint.type === "revolute") matrix.multiply(new Matrix4().makeRotationAxis(new Vector3(...axisOf(joint)).normalize(), q));
      return matrix;
    };
    const robot = imported();
    const random = seededRandom(12);
    let worstMm = 0;
    let worstCase = "";
    for (let sample = 0; sample < 2000; sample += 1) {
      const prefix = ["fl", "fr", "rl", "rr"][sample % 4];
      const legId = prefix.toUpperCase();
      const chain = ["coxa", "femur", "tibia"].map((part) => jointNamed(`${prefix}_${part}`));
      const q = chain.map((joint) => {
        if (!joint.limit) throw new Error(`joint ${joint.name} has no limits`);
        return random.between(Number(joint.limit.lower), Number(joint.limit.upper));
      });
      const matrix = new Matrix4();
      chain.forEach((joint, index) => matrix.multiply(jointMatrix(joint, q[index])));
      matrix.multiply(jointMatrix(jointNamed(`${prefix}_foot`), 0));
      const foot = new Vector3().setFromMatrixPosition(matrix);
      // DESIGN.md: our coxa turns about +z; our femur and tibia about −y, so a URDF axis (0, ±1, 0) has the opposite sign.
      const axisSign = (joint: UrdfJoint, index: number) => Math.sign(axisOf(joint)[index]);
      const ours = {
        coxa: (q[0] * axisSign(chain[0], 2) * 180) / Math.PI,
        femur: (-q[1] * axisSign(chain[1], 1) * 180) / Math.PI,
        tibia: (-q[2] * axisSign(chain[2], 1) * 180) / Math.PI,
      };
      const got = forwardLeg(robot, legId, ours);
      const errorMm = distanceMm([foot.x, foot.y, foot.z], got);
      if (errorMm > worstMm) {
        worstMm = errorMm;
        worstCase = `${legId} q = ${q.join(", ")} rad: expected [${foot.x}, ${foot.y}, ${foot.z}] mm, got [${got.join(", ")}] mm`;
      }
    }
    expect(worstMm, `worst foot error (mm) — ${worstCase}`).toBeLessThanOrEqual(1e-6);
  });

  it("reports what it mapped and what it assumed", () => {
    const result = importUrdf(urdf, { standHeightMm: 80 });
    if (!result.ok) throw new Error(JSON.stringify(result.issues));
    expect(result.report).toContain('base link "base_link" is the body frame; 4 legs found');
    expect(result.report).toContain('ignored fixed joint "imu_joint" to "imu_link" (no moving parts)');
    expect(result.report).toContain(
      'leg FL: fl_coxa → fl_femur → fl_tibia → foot "fl_foot"; mount (60, 40, -3) mm, yaw 35°; coxa 32 mm, femur 70 mm, tibia 100 mm; zero offsets femur 10°, tibia 36.87°',
    );
    expect(result.report).toContain('leg RL: coxa "rl_coxa" axis (0 0 -1) turns against our sense: its angles and limits are negated');
    expect(result.report).toContain('leg RL: coxa "rl_coxa" gives no limit velocity: maxSpeedDegS set to 300');
    expect(result.report.some((line) => line.startsWith("servo mapping not in URDF: channels 0–11"))).toBe(true);
  });

  it("takes the stand height from URDF-free defaults when not given", () => {
    const result = importUrdf(urdf);
    expect(result.ok && result.robot.standHeight).toBe(Math.round(0.55 * 170));
  });

  const refusals: [string, string, { path: string; message: string }][] = [
    [
      "a prismatic joint",
      editJoint("fl_femur", (line) => line.replace('type="revolute"', 'type="prismatic"')),
      {
        path: "joint.fl_femur.type",
        message: 'joint "fl_femur" (femur) is prismatic: only revolute joints make a leg',
      },
    ],
    [
      "a continuous joint",
      editJoint("fr_tibia", (line) => line.replace('type="revolute"', 'type="continuous"')),
      {
        path: "joint.fr_tibia.type",
        message: 'joint "fr_tibia" (tibia) is continuous: a leg joint must be revolute, with limits',
      },
    ],
    [
      "a joint without limits",
      editJoint("rl_tibia", (line) => line.replace(/<limit [^>]*\/>/, "")),
      {
        path: "joint.rl_tibia.limit",
        message: 'joint "rl_tibia" (tibia) has no <limit lower upper>: a leg joint needs its limits',
      },
    ],
    [
      "a coxa axis along x",
      editJoint("fl_coxa", (line) => line.replace('<axis xyz="0 0 1"/>', '<axis xyz="1 0 0"/>')),
      {
        path: "joint.fl_coxa.axis",
        message: 'coxa joint "fl_coxa": axis (1 0 0) is not along ±z',
      },
    ],
    [
      "a femur axis along z",
      editJoint("rr_femur", (line) => line.replace('<axis xyz="0 -1 0"/>', '<axis xyz="0 0 1"/>')),
      {
        path: "joint.rr_femur.axis",
        message: 'femur joint "rr_femur": axis (0 0 1) is not along ±y',
      },
    ],
    [
      "a leg of two joints",
      editJoint("fl_tibia", (line) => line.replace('type="revolute"', 'type="fixed"')),
      {
        path: "joint.fl_femur",
        message: 'the chain from coxa joint "fl_coxa" ends after 2 joints at "fl_femur": a leg has three revolute joints',
      },
    ],
    [
      "a leg of four joints",
      editJoint("fr_foot", (line) =>
        line.replace('type="fixed"', 'type="revolute"').replace("</joint>", '<axis xyz="0 1 0"/><limit lower="-1" upper="1"/></joint>'),
      ),
      {
        path: "joint.fr_foot",
        message: 'joint "fr_foot" follows tibia joint "fr_tibia": a leg has exactly three revolute joints',
      },
    ],
    [
      "a leg without a foot tip",
      editJoint("rr_foot", () => "").replace('<link name="rr_foot_link"/>', ""),
      {
        path: "joint.rr_tibia",
        message: 'tibia joint "rr_tibia" has no fixed joint to a foot tip after it: the tibia is measured from the knee to the foot tip',
      },
    ],
    [
      "a femur joint off the leg plane",
      editJoint("fl_femur", (line) => line.replace('xyz="0.032 0 -0.005"', 'xyz="0.032 0.003 -0.005"')),
      {
        path: "joint.fl_femur.origin.xyz",
        message: 'joint "fl_femur" sits 3 mm off the leg plane (origin y must be 0)',
      },
    ],
    [
      "a tilted coxa",
      editJoint("fl_coxa", (line) => line.replace('rpy="0 0 0.6108652381980153"', 'rpy="0.1 0 0.6108652381980153"')),
      {
        path: "joint.fl_coxa.origin.rpy",
        message: 'coxa joint "fl_coxa": origin roll and pitch must be 0 (got 5.73°, 0°): the coxa turns about the body\'s vertical',
      },
    ],
    [
      "XML that is not well-formed",
      urdf.replace("</robot>", ""),
      {
        path: "",
        message: expect.stringMatching(/^not well-formed XML: .+ \(line \d+, column \d+\)$/) as unknown as string,
      },
    ],
    ["a document without <robot>", "<model/>", { path: "", message: "no <robot> element: not a URDF document" }],
    [
      "a link with two parents",
      urdf.replace('<child link="imu_link"/>', '<child link="fl_coxa_link"/>'),
      {
        path: "joint.fl_coxa.child",
        message: 'link "fl_coxa_link" is the child of two joints (one is "fl_coxa"): URDF links form a tree',
      },
    ],
    [
      "two root links",
      urdf.replace('<link name="imu_link"/>', '<link name="imu_link"/><link name="stray_link"/>'),
      {
        path: "link",
        message: "expected one root link, found 2 (base_link, stray_link); pass baseLink",
      },
    ],
  ];
  for (const [what, xml, expected] of refusals) {
    it(`refuses ${what}, naming the joint`, () => {
      expect(refusal(xml)).toEqual([expected]);
    });
  }
});
