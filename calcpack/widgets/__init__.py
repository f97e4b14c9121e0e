"""ipywidgets input panels (imported lazily, never by computation).

:func:`beam_panel`, :func:`section_panel`, :func:`member_panel` (steel column),
:func:`beam_member_panel` (steel, sawn or glulam beam member) and :func:`timber_post_panel`
edit a sheet's inputs file (the catalogue panels are built on :class:`InputsPanel`);
:func:`preview` shows the sheet as the issued PDF lays it out. Names load on first use so
that importing ``calcpack.widgets`` in a sheet costs nothing until a panel is made.
"""

from __future__ import annotations

from calcpack._lazy import lazy_attributes

__all__ = [
    "BeamMemberPanel",
    "BeamPanel",
    "FootingPanel",
    "InputsPanel",
    "LedgerPanel",
    "MemberPanel",
    "SectionPanel",
    "SiteLoadsPanel",
    "TimberPostPanel",
    "beam_member_panel",
    "beam_panel",
    "footing_panel",
    "ledger_panel",
    "member_panel",
    "preview",
    "section_panel",
    "site_loads_panel",
    "timber_post_panel",
]

_WHERE = {
    "BeamPanel": "calcpack.widgets.beam",
    "beam_panel": "calcpack.widgets.beam",
    "SectionPanel": "calcpack.widgets.section",
    "section_panel": "calcpack.widgets.section",
    "preview": "calcpack.widgets.pages",
    "InputsPanel": "calcpack.widgets.panel",
    "MemberPanel": "calcpack.widgets.member",
    "member_panel": "calcpack.widgets.member",
    "FootingPanel": "calcpack.widgets.footing",
    "footing_panel": "calcpack.widgets.footing",
    "SiteLoadsPanel": "calcpack.widgets.site_loads",
    "site_loads_panel": "calcpack.widgets.site_loads",
    "LedgerPanel": "calcpack.widgets.ledger",
    "ledger_panel": "calcpack.widgets.ledger",
    "BeamMemberPanel": "calcpack.widgets.sized_member",
    "beam_member_panel": "calcpack.widgets.sized_member",
    "TimberPostPanel": "calcpack.widgets.sized_member",
    "timber_post_panel": "calcpack.widgets.sized_member",
}


__getattr__, __dir__ = lazy_attributes("calcpack.widgets", _WHERE, globals(), __all__)
