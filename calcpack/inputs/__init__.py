"""Inputs files: the small TOML file beside each sheet that panels edit and calc cells read.

::

    from calcpack.inputs import load_inputs, beam_inputs, evaluate_beam
    data = load_inputs("02_beam.inputs.toml")     # unit strings -> pint quantities
    outcome = evaluate_beam(beam_inputs(data))    # the same numbers the beam panel shows

Pure: no Jupyter or widget imports, so a build executes the sheet without any hidden state.
"""

from calcpack.inputs.beam import (
    SUPPORT_KINDS,
    BeamInputs,
    BeamOutcome,
    SpanDeflection,
    beam_inputs,
    evaluate_beam,
)
from calcpack.inputs.file import (
    InputsFileError,
    Spec,
    format_quantity,
    get_path,
    iter_quantities,
    load_inputs,
    parse_quantity,
    read_inputs_text,
    require_input,
    update_inputs,
    write_inputs,
)
from calcpack.inputs.section import SHAPES, ShapeForm, section_from_inputs, section_inputs

__all__ = [
    "SHAPES",
    "SUPPORT_KINDS",
    "BeamInputs",
    "BeamOutcome",
    "InputsFileError",
    "ShapeForm",
    "SpanDeflection",
    "Spec",
    "beam_inputs",
    "evaluate_beam",
    "format_quantity",
    "get_path",
    "iter_quantities",
    "load_inputs",
    "parse_quantity",
    "read_inputs_text",
    "require_input",
    "section_from_inputs",
    "section_inputs",
    "update_inputs",
    "write_inputs",
]
