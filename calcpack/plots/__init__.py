"""Figures (matplotlib, SVG) that read results only. Imported lazily, never by computation."""
