"""Load types, resultants and load cases."""
