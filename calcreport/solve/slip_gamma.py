"""The γ-method of EN 1995-1-1:2004 Annex B for mechanically jointed beams, as plain functions.

Plain floats in one consistent unit set (the solver uses lbf and inches). A section is a list of
:class:`Layer` — the outer parts 1 and 3 (each held by one joint) and the web 2 (γ₂ = 1) — each
with its own E·A, E·I about its own centroid and centroid height y. The general form used here,

    y₀ = Σ γᵢ·Eᵢ·Aᵢ·yᵢ / Σ γᵢ·Eᵢ·Aᵢ,   aᵢ = yᵢ − y₀,

is the neutral axis of the partially jointed section; for the layouts of Figure B.1 it gives the
distances aᵢ of B.2 exactly, and it applies unchanged to box
sections whose flanges sit between the webs.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

__all__ = [
    "Layer",
    "gamma",
    "effective_spacing",
    "neutral_axis",
    "ei_effective",
    "row_force",
    "web_shear_max",
    "normal_stress",
    "bending_stress",
]


@dataclass(frozen=True)
class Layer:
    """One part (or group of parts counted together) of the section."""

    EA: float
    EI: float  # about the layer's own centroid
    y: float  # centroid height
    K: float | None = None  # slip modulus of its joint's connectors per row (None: the web, γ = 1)
    s: float | None = None  # spacing of the rows


def gamma(EA: float, K: float, s: float, ell: float) -> float:
    """γᵢ = 1 / (1 + π²·Eᵢ·Aᵢ·sᵢ / (Kᵢ·ℓ²)). Source: EN 1995-1-1:2004 Annex B, B.2.

    ``K`` is the slip modulus of the connectors in one row (per_row × per connector), ``s`` the
    row spacing, ``ell`` the effective length (B.2). K = 0 gives γ = 0 (no composite action);
    K → ∞ gives γ → 1 (rigid).
    """
    if K <= 0.0:
        return 0.0
    return 1.0 / (1.0 + math.pi**2 * EA * s / (K * ell**2))


def effective_spacing(s_min: float, s_max: float) -> float:
    """s_ef = 0.75·s_min + 0.25·s_max, for spacing that varies with the shear force between s_min
    and s_max ≤ 4·s_min. Source: EN 1995-1-1:2004 §9.1.3(3)."""
    return 0.75 * s_min + 0.25 * s_max


def gammas(layers: list[Layer], ell: float) -> list[float]:
    """γ of each layer: 1 for the web (no K), B.2 for the others."""
    return [1.0 if L.K is None or L.s is None else gamma(L.EA, L.K, L.s, ell) for L in layers]


def neutral_axis(layers: list[Layer], g: list[float]) -> float:
    """Height of the neutral axis y₀ = Σγ·E·A·y / Σγ·E·A. Source: EN 1995-1-1:2004 Annex B
    B.2, in its general form (mechanics of materials: the centroid of the γ-weighted areas)."""
    num = sum(gi * L.EA * L.y for gi, L in zip(g, layers))
    den = sum(gi * L.EA for gi, L in zip(g, layers))
    return num / den


def ei_effective(layers: list[Layer], g: list[float]) -> tuple[float, list[float]]:
    """(EI)_ef = Σ(Eᵢ·Iᵢ + γᵢ·Eᵢ·Aᵢ·aᵢ²) and the distances aᵢ. Source: EN 1995-1-1:2004 Annex B,
    B.2."""
    y0 = neutral_axis(layers, g)
    a = [L.y - y0 for L in layers]
    return sum(L.EI + gi * L.EA * ai**2 for L, gi, ai in zip(layers, g, a)), a


def row_force(EA: float, g: float, a: float, s: float, V: float, EI_ef: float) -> float:
    """Force on one row of connectors Fᵢ = γᵢ·Eᵢ·Aᵢ·aᵢ·sᵢ·V / (EI)_ef.
    Source: EN 1995-1-1:2004 Annex B, B.5."""
    return g * EA * abs(a) * s * V / EI_ef


def normal_stress(E: float, g: float, a: float, M: float, EI_ef: float) -> float:
    """σᵢ = γᵢ·Eᵢ·aᵢ·M / (EI)_ef at a layer's centroid. Source: EN 1995-1-1:2004 Annex B, B.3."""
    return g * E * a * M / EI_ef


def bending_stress(E: float, h: float, M: float, EI_ef: float) -> float:
    """σ_m,i = 0.5·Eᵢ·hᵢ·M / (EI)_ef at a layer's edge about its own centroid.
    Source: EN 1995-1-1:2004 Annex B, B.3."""
    return 0.5 * E * h * M / EI_ef


def web_shear_max(
    g_out: float, EA_out: float, a_out: float, E_web: float, b_web: float, h: float, V: float, EI_ef: float
) -> float:
    """τ₂,max = (γ₃·E₃·A₃·a₃ + 0.5·E₂·b₂·h²)·V / (b₂·(EI)_ef) at the neutral axis of the web, with
    the outer part and the web band on one side of the neutral axis (h: web edge to the neutral
    axis). Source: EN 1995-1-1:2004 Annex B, B.4."""
    return (g_out * EA_out * abs(a_out) + 0.5 * E_web * b_web * h * h) * V / (b_web * EI_ef)
