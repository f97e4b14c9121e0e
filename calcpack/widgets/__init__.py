"""ipywidgets input panels (imported lazily, never by computation)."""
