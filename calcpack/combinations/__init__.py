"""Load combinations as data, superposition and envelopes."""
