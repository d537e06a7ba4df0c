import { describe, expect, it } from "vitest";
import { Matrix4, Vector3 } from "three";
import { poseApply, poseRotation, poseUnapply, type BodyPose } from "../../app/kinematics";
import { seededRandom } from "./support/prng";
import { poseMatrix } from "./support/reference-fk";

describe("body pose R = Rz(yaw)·Ry(pitch)·Rx(roll) (ROS REP 103 fixed-axis roll, pitch, yaw)", () => {
  it("matches three.js Matrix4 with Euler order 'ZYX' on 1000 seeded poses (reference library)", () => {
    const random = seededRandom(9);
    let worst = 0;
    for (let sample = 0; sample < 1000; sample += 1) {
      const pose: BodyPose = {
        x: random.between(-50, 50),
        y: random.between(-50, 50),
        z: random.between(-50, 50),
        roll: random.between(-180, 180),
        pitch: random.between(-89, 89),
        yaw: random.between(-180, 180),
      };
      const ours = poseRotation(pose);
      const reference = new Matrix4().extractRotation(poseMatrix(pose)).elements; // column-major
      for (let row = 0; row < 3; row += 1) {
        for (let column = 0; column < 3; column += 1) worst = Math.max(worst, Math.abs(ours[row * 3 + column] - reference[column * 4 + row]));
      }
      const point: [number, number, number] = [random.between(-200, 200), random.between(-200, 200), random.between(-200, 200)];
      const moved = new Vector3(...point).applyMatrix4(poseMatrix(pose));
      const ourMoved = poseApply(pose, point);
      worst = Math.max(worst, Math.abs(moved.x - ourMoved[0]), Math.abs(moved.y - ourMoved[1]), Math.abs(moved.z - ourMoved[2]));
      const back = poseUnapply(pose, ourMoved);
      worst = Math.max(worst, Math.abs(back[0] - point[0]), Math.abs(back[1] - point[1]), Math.abs(back[2] - point[2]));
    }
    expect(worst, "largest difference (matrix entry or mm)").toBeLessThan(1e-9);
  });

  it("positive pitch lowers the nose, positive roll raises the left side, positive yaw turns left (REP 103 right-hand rule)", () => {
    const neutral = { x: 0, y: 0, z: 0, roll: 0, pitch: 0, yaw: 0 };
    expect(poseApply({ ...neutral, pitch: 10 }, [100, 0, 0])[2], "nose height (mm)").toBeLessThan(0);
    expect(poseApply({ ...neutral, roll: 10 }, [0, 100, 0])[2], "left side height (mm)").toBeGreaterThan(0);
    expect(poseApply({ ...neutral, yaw: 10 }, [100, 0, 0])[1], "nose y (mm)").toBeGreaterThan(0);
  });
});
