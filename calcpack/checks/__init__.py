"""Design checks: one module per design standard behind one small common interface."""
