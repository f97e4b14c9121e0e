"""Structural analysis: beams, trusses and free bodies (model data kept apart from solvers)."""
