"""Cross-section shapes, composite assembly and section properties."""
