"""The direct stiffness method for a plane pin-jointed truss (numeric core, SI floats).

Each member's axial stiffness EA / L is assembled into the global stiffness matrix; the
supports enter as constraints ``C u = 0`` along their reaction directions, solved together with
``K u = p + Cᵀ R`` (Lagrange multipliers), which treats inclined rollers exactly. Returns
displacements (m, +x and +y), member forces (N, tension positive) and reactions (N, positive
along their directions).
"""

from __future__ import annotations

import numpy as np

from calcpack.analysis.truss_model import FloatArray, Truss

__all__ = ["stiffness_solve"]


def stiffness_solve(truss: Truss, p: FloatArray) -> tuple[FloatArray, FloatArray, FloatArray]:
    """Direct stiffness method with the supports as constraints (Lagrange multipliers, which
    handles inclined rollers exactly). Returns displacements (m), member forces (N), reactions
    (N)."""
    nj, nm = len(truss.nodes), len(truss.members)
    K = np.zeros((2 * nj, 2 * nj))
    k_axial = np.array([m.EA.to("N").magnitude for m in truss.members if m.EA is not None])
    k_axial = k_axial / truss.lengths_m
    for k, (s, e) in enumerate(truss.member_ends):
        c = truss.unit_vectors[k]
        kc = k_axial[k] * np.outer(c, c)
        for a, b, sign in ((s, s, 1), (e, e, 1), (s, e, -1), (e, s, -1)):
            K[2 * a : 2 * a + 2, 2 * b : 2 * b + 2] += sign * kc
    nr = len(truss.reactions)
    C = np.zeros((nr, 2 * nj))
    for r, (_, i, d) in enumerate(truss.reactions):
        C[r, 2 * i : 2 * i + 2] = d
    # K u = p + C^T R  and  C u = 0 (supports do not move along their reactions).
    big = np.block([[K, -C.T], [C, np.zeros((nr, nr))]])
    sol = np.linalg.solve(big, np.concatenate([p, np.zeros(nr)]))
    u, R = sol[: 2 * nj], sol[2 * nj :]
    N = np.zeros(nm)
    for k, (s, e) in enumerate(truss.member_ends):
        c = truss.unit_vectors[k]
        N[k] = k_axial[k] * float(c @ (u[2 * e : 2 * e + 2] - u[2 * s : 2 * s + 2]))
    return u, N, R
