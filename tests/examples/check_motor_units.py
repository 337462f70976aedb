"""check_motor_units.py BUNDLE: the motor-unit columns of steps.csv and kernel_rounding_max of
summary.json against the documented formulas (docs/plan-files.md, "Motor units"), recomputed
here with the example reader and a Jones calculus of its own (docs/conventions.md: a plate at
axis t with retardance G is R(-t) diag(1, e^{iG}) R(t); Hecht, Optics, ch. 8)."""
import cmath
import csv
import io
import json
import math
import sys

import read_bundle


def plate(t_deg, g):
    t = math.radians(t_deg)
    c, s = math.cos(t), math.sin(t)
    e = cmath.exp(1j * g)
    # R(-t) diag(1, e) R(t), R(t) = [[c, s], [-s, c]]
    return [[c * c + e * s * s, c * s - e * c * s], [s * c - e * s * c, s * s + e * c * c]]


def apply(m, v):
    return [m[0][0] * v[0] + m[0][1] * v[1], m[1][0] * v[0] + m[1][1] * v[1]]


def kernel(bundle, pos):
    k = 1.0
    for p in range(bundle.photons):
        angle = {}
        for m in bundle.motors:
            if m.photon == p:
                angle[(m.stage, m.plate)] = pos[m.name]
        v = [1.0, 0.0]
        v = apply(plate(angle[("prep", "HWP")], math.pi), v)
        v = apply(plate(angle[("prep", "QWP")], math.pi / 2), v)
        v = apply(plate(angle[("analysis", "QWP")], math.pi / 2), v)
        v = apply(plate(angle[("analysis", "HWP")], math.pi), v)
        k *= abs(v[0]) ** 2
    return k


def main(path):
    bundle = read_bundle.Bundle(path)
    with_units = [m for m in bundle.motors if m.has_motor_units()]
    assert with_units and len(with_units) < len(bundle.motors), "test campaign has mixed motors"
    rows = list(csv.DictReader(io.StringIO(bundle.entries["steps.csv"].decode("utf-8"))))
    header = list(rows[0].keys())
    deg_columns = [m.name + "_deg" for m in bundle.motors]
    step_columns = [m.name + "_steps" for m in with_units]
    last_deg = header.index(deg_columns[-1])
    assert header[last_deg + 1:last_deg + 1 + len(step_columns)] == step_columns, header
    worst_error_steps = 0.0
    rounding_max = 0.0
    steps = list(bundle.steps())
    assert len(steps) == len(rows)
    for step, row in zip(steps, rows):
        units = step.motor_units()
        rounded = dict(step.position_deg)
        for m in with_units:
            written = int(row[m.name + "_steps"])
            assert written == units[m.name], (step.index, m.name, written, units[m.name])
            back = m.from_motor_units(written)
            # Within half a step of the degree position (plus rounding of the doubles).
            error = abs(back - step.position_deg[m.name]) * m.steps_per_deg
            assert error <= 0.5 + 1e-9, (step.index, m.name, error)
            worst_error_steps = max(worst_error_steps, error)
            rounded[m.name] = back
        # The degree column still holds the plate position.
        for m in bundle.motors:
            assert float(row[m.name + "_deg"]) == step.position_deg[m.name]
        if step.kind == "measure":
            rounding_max = max(rounding_max,
                               abs(kernel(bundle, rounded) - kernel(bundle, step.position_deg)))
    summary = json.loads(bundle.entries["summary.json"].decode("utf-8"))
    written = summary["kernel_rounding_max"]
    assert abs(written - rounding_max) <= 1e-12, (written, rounding_max)
    # A plate turned by d rotates the Stokes vector after it by at most 4d, and a photon's
    # kernel factor (1 + s.s')/2 by at most 2d: the sum over the plates bounds the change
    # (common practice; Poincare-sphere picture of waveplates).
    bound = sum(2 * math.radians(0.5 / m.steps_per_deg) for m in with_units)
    assert 0 < written <= bound, (written, bound)
    print("motor units: worst %.3f step from the degree position; kernel_rounding_max %.3g "
          "(recomputed %.3g, bound %.3g)" % (worst_error_steps, written, rounding_max, bound))


if __name__ == "__main__":
    main(sys.argv[1])
