"""The trade study of tests/benches/study.rs done the straightforward way in numpy.

Glauert's sine series by collocation (the same method and term count as gammaline's default):
for each of 1,001 variants (the trainer example, washout 0 to 5 deg added linearly root to
tip, solved for CL 0.5) build the N x N collocation matrix over the whole span, solve it for
the responses at zero alpha and per radian of alpha, find the alpha for the CL and form CDi
and e. Controls enter as a step in the zero-lift angle at the collocation points (thin-airfoil
effectiveness, or the file's own factor). Prints the best of five timings.
"""

import math
import time
import tomllib

import numpy as np

TERMS = 60


def stations(path):
    with open(path, "rb") as f:
        wing = tomllib.load(f)
    rows = wing["station"]
    return wing, [r["y"] for r in rows], [r["chord"] for r in rows], [r["twist"] for r in rows]


def effectiveness(control):
    if "effectiveness" in control:
        return control["effectiveness"]
    theta_h = math.acos(2.0 * control["chord_fraction"] - 1.0)
    return 1.0 - (theta_h - math.sin(theta_h)) / math.pi


def study(path, washouts, cl):
    wing, ys, chords, twists = stations(path)
    airfoil = next(iter(wing["airfoil"].values()))
    a0 = airfoil["lift_slope"]
    alpha_l0 = math.radians(airfoil["alpha_zero_lift"])
    half = ys[-1]
    span = 2.0 * half
    theta = np.arange(1, TERMS + 1) * math.pi / (TERMS + 1)
    y = -half * np.cos(theta)
    ay = np.abs(y)
    area = 2.0 * sum(0.5 * (c0 + c1) * (y1 - y0) for y0, y1, c0, c1 in zip(ys, ys[1:], chords, chords[1:]))
    aspect = span * span / area
    n = np.arange(1, TERMS + 1)
    shift = np.zeros(TERMS)
    for control in wing.get("control", []):
        inside = (ay >= control["y_inner"]) & (ay <= control["y_outer"])
        sign = np.sign(y) if control["kind"] == "aileron" else 1.0
        shift += np.where(inside, effectiveness(control) * math.radians(control["deflection"]) * sign, 0.0)
    out = []
    for washout in washouts:
        chord = np.interp(ay, ys, chords)
        twist = np.radians(np.interp(ay, ys, twists) - washout * ay / half)
        mu = 4.0 * span / (a0 * chord)
        sin_nt = np.sin(np.outer(theta, n))
        matrix = mu[:, None] * sin_nt + n[None, :] * sin_nt / np.sin(theta)[:, None]
        responses = np.linalg.solve(matrix, np.column_stack([twist - alpha_l0 + shift, np.ones(TERMS)]))
        at_zero, per_alpha = responses[:, 0], responses[:, 1]
        alpha = (cl / (math.pi * aspect) - at_zero[0]) / per_alpha[0]
        a = at_zero + alpha * per_alpha
        cdi = math.pi * aspect * float(np.sum(n * a * a))
        out.append((math.degrees(alpha), cdi, cl * cl / (math.pi * aspect * cdi)))
    return out


def main():
    washouts = [i * 0.005 for i in range(1001)]
    best = float("inf")
    for _ in range(5):
        start = time.perf_counter()
        rows = study("wings/trainer.toml", washouts, 0.5)
        best = min(best, time.perf_counter() - start)
    print(
        f"numpy {np.__version__}: 1001 washout variants in {best * 1e3:.1f} ms "
        f"(best of 5); washout 0: alpha {rows[0][0]:.4f} deg, CDi {rows[0][1]:.6f}, e {rows[0][2]:.4f}"
    )


if __name__ == "__main__":
    main()
