"""The public names that :mod:`calcpack` loads on first use, as imports for type checkers.

Never imported at run time: ``calcpack/__init__.py`` star-imports it under ``TYPE_CHECKING``, and
each name is imported as itself (``X as X``) so that type checkers take it as re-exported. The
run-time table is :data:`calcpack._lazy.PUBLIC`; ``tests/unit/test_public_api.py`` keeps the
two equal.
"""

# The import sorter would split every "X as X" into an import of its own.
# ruff: noqa: I001

from __future__ import annotations

from calcpack.analysis.beam import (
    Beam as Beam,
    BeamResult as BeamResult,
    EISegment as EISegment,
    Fixed as Fixed,
    Hinge as Hinge,
    Pin as Pin,
    Roller as Roller,
    Spring as Spring,
    combine as combine,
    solve_beam as solve_beam,
    solve_cases as solve_cases,
)
from calcpack.analysis.estimates import (
    Estimate as Estimate,
    beam_table as beam_table,
    continuous_equal_spans as continuous_equal_spans,
    section_cut as section_cut,
    statical_moment as statical_moment,
    tributary_reactions as tributary_reactions,
)
from calcpack.analysis.freebody import (
    BodySupport as BodySupport,
    Couple as Couple,
    DistributedLoad as DistributedLoad,
    FreeBody as FreeBody,
    PointForce as PointForce,
    solve_free_body as solve_free_body,
)
from calcpack.analysis.truss_envelope import (
    MemberEnvelope as MemberEnvelope,
    member_envelopes as member_envelopes,
)
from calcpack.analysis.truss_model import (
    JointLoad as JointLoad,
    Member as Member,
    Node as Node,
    Support as Support,
    Truss as Truss,
)
from calcpack.analysis.truss_solve import (
    TrussResult as TrussResult,
    solve_truss as solve_truss,
    solve_truss_cases as solve_truss_cases,
)
from calcpack.checks import (
    IShape as IShape,
    ReferenceDesignValues as ReferenceDesignValues,
    SawnMember as SawnMember,
    ServiceConditions as ServiceConditions,
    check_aisc_beam as check_aisc_beam,
    check_deflection as check_deflection,
    check_elastic_beam as check_elastic_beam,
    check_nds_beam as check_nds_beam,
    summary_table as summary_table,
)
from calcpack.checks.aci318 import (
    ACIFootingDesign as ACIFootingDesign,
    check_aci_footing as check_aci_footing,
)
from calcpack.checks.aci318.anchor_data import (
    AnchorGroup as AnchorGroup,
    AnchorLoads as AnchorLoads,
    anchor_steel as anchor_steel,
)
from calcpack.checks.aci318.anchors import check_aci_anchors as check_aci_anchors
from calcpack.checks.aisc360.bearing import (
    BasePlate as BasePlate,
    ConcentratedForce as ConcentratedForce,
    check_aisc_base_plate as check_aisc_base_plate,
    check_aisc_web_bearing as check_aisc_web_bearing,
)
from calcpack.checks.aisc360.bearing_j7 import (
    BearingSurface as BearingSurface,
    check_aisc_bearing as check_aisc_bearing,
)
from calcpack.checks.aisc360.bolts import (
    BoltGroup as BoltGroup,
    Ply as Ply,
    SlipCritical as SlipCritical,
    check_aisc_bolts as check_aisc_bolts,
)
from calcpack.checks.aisc360.bracing import (
    BraceCase as BraceCase,
    check_aisc_bracing as check_aisc_bracing,
)
from calcpack.checks.aisc360.bracing_torsional import (
    TorsionalBraceCase as TorsionalBraceCase,
    check_aisc_torsional_bracing as check_aisc_torsional_bracing,
)
from calcpack.checks.aisc360.combined_h2 import (
    H2Case as H2Case,
    H2Point as H2Point,
    angle_h2_case as angle_h2_case,
    check_aisc_h2 as check_aisc_h2,
)
from calcpack.checks.aisc360.compression_angle import (
    AngleStrut as AngleStrut,
    check_aisc_angle_strut as check_aisc_angle_strut,
)
from calcpack.checks.aisc360.elements import (
    BlockShear as BlockShear,
    ConnectingPlate as ConnectingPlate,
    check_aisc_anchor_rods as check_aisc_anchor_rods,
    check_aisc_block_shear as check_aisc_block_shear,
    check_aisc_plate as check_aisc_plate,
)
from calcpack.checks.aisc360.member import (
    check_aisc_member as check_aisc_member,
)
from calcpack.checks.aisc360.member_data import (
    MemberForces as MemberForces,
    SteelMember as SteelMember,
)
from calcpack.checks.aisc360.welds import (
    BaseMetal as BaseMetal,
    FilletWeld as FilletWeld,
    check_aisc_fillet_weld as check_aisc_fillet_weld,
)
from calcpack.checks.checklists import (
    load_checklists as load_checklists,
    member_checklist as member_checklist,
)
from calcpack.checks.en1992 import (
    ECFootingDesign as ECFootingDesign,
    check_en1992_footing as check_en1992_footing,
)
from calcpack.checks.en1993 import (
    DesignForces as DesignForces,
    SteelMemberEC as SteelMemberEC,
    check_en1993_beam as check_en1993_beam,
    check_en1993_member as check_en1993_member,
    check_en1993_web_bearing as check_en1993_web_bearing,
)
from calcpack.checks.en1995 import (
    TimberForcesEC as TimberForcesEC,
    TimberMemberEC as TimberMemberEC,
    check_en1995_deflection as check_en1995_deflection,
    check_en1995_floor_vibration as check_en1995_floor_vibration,
    check_en1995_member as check_en1995_member,
    strength_class as strength_class,
)
from calcpack.checks.en1996 import (
    MasonryWall as MasonryWall,
    Padstone as Padstone,
    check_en1996_bearing as check_en1996_bearing,
    masonry_fk as masonry_fk,
)
from calcpack.checks.en1997 import (
    PresumedBearing as PresumedBearing,
    SoilStrength as SoilStrength,
    check_en1997_pad as check_en1997_pad,
)
from calcpack.checks.joint_sketch import (
    JointSketch as JointSketch,
    bolt_pattern_sketch as bolt_pattern_sketch,
    dowel_layout_sketch as dowel_layout_sketch,
    ledger_sketch as ledger_sketch,
    weld_sketch as weld_sketch,
)
from calcpack.checks.nds.bearing import (
    TimberBearing as TimberBearing,
    check_nds_bearing as check_nds_bearing,
    check_nds_notched_shear as check_nds_notched_shear,
    long_term_deflection as long_term_deflection,
)
from calcpack.checks.connector import (
    ConnectorListing as ConnectorListing,
    check_connector as check_connector,
)
from calcpack.checks.uplift import (
    ResistingWeight as ResistingWeight,
    UpliftByWeight as UpliftByWeight,
    check_uplift_by_weight as check_uplift_by_weight,
)
from calcpack.checks.ibc2018 import (
    EmbeddedPost as EmbeddedPost,
    check_embedment as check_embedment,
)
from calcpack.checks.nds.posts import (
    check_nds_post as check_nds_post,
)
from calcpack.checks.nds.connection import (
    ConnectionService as ConnectionService,
    FastenerLayout as FastenerLayout,
    GroupStiffness as GroupStiffness,
    check_nds_connection as check_nds_connection,
)
from calcpack.checks.nds.dowel import (
    DowelJoint as DowelJoint,
    Embedment as Embedment,
    Fastener as Fastener,
    SteelPlate as SteelPlate,
    WoodMember as WoodMember,
    nds_fastener as nds_fastener,
    yield_limits as yield_limits,
)
from calcpack.checks.nds.glulam import (
    check_nds_glulam_beam as check_nds_glulam_beam,
)
from calcpack.checks.nds.ledger import (
    DeckLedger as DeckLedger,
    PrescriptiveSpacing as PrescriptiveSpacing,
    check_deck_ledger as check_deck_ledger,
)
from calcpack.checks.nds.members import (
    TimberForces as TimberForces,
    TimberMember as TimberMember,
    check_nds_member as check_nds_member,
)
from calcpack.checks.nds.values import (
    TimberValues as TimberValues,
    nds_glulam_values as nds_glulam_values,
    nds_sawn_grades as nds_sawn_grades,
    nds_sawn_values as nds_sawn_values,
    southern_pine_size_factor as southern_pine_size_factor,
)
from calcpack.checks.nds.withdrawal import (
    check_nds_combined as check_nds_combined,
    check_nds_tearout as check_nds_tearout,
    check_nds_withdrawal as check_nds_withdrawal,
)
from calcpack.combinations import (
    CombinationSet as CombinationSet,
    LoadCombination as LoadCombination,
    analyse_combinations as analyse_combinations,
    annex_combinations as annex_combinations,
    annex_equ_combinations as annex_equ_combinations,
    annex_serviceability as annex_serviceability,
    combination_set as combination_set,
    en1990_annex as en1990_annex,
    pattern_cases as pattern_cases,
    superpose as superpose,
)
from calcpack.contract import (
    CheckRecord as CheckRecord,
    Manifest as Manifest,
    diff_manifests as diff_manifests,
)
from calcpack.foundations import (
    AllowableBearing as AllowableBearing,
    Column as Column,
    Footing as Footing,
    FootingLoad as FootingLoad,
    SafetyFactors as SafetyFactors,
    SiteConditions as SiteConditions,
    check_footing_soil as check_footing_soil,
    soil_pressure as soil_pressure,
)
from calcpack.inputs import (
    load_inputs as load_inputs,
    update_inputs as update_inputs,
)
from calcpack.loads import (
    AreaLoad as AreaLoad,
    FunctionLoad as FunctionLoad,
    LinearLoad as LinearLoad,
    PointLoad as PointLoad,
    PointMoment as PointMoment,
    PolynomialLoad as PolynomialLoad,
    UniformLoad as UniformLoad,
    resultant as resultant,
)
from calcpack.loads.lintel_masonry import (
    LintelLoads as LintelLoads,
    WallPointLoad as WallPointLoad,
    lintel_masonry_loads as lintel_masonry_loads,
)
from calcpack.loads.roof_cases import (
    RoofProfile as RoofProfile,
    case_groups as case_groups,
    line_loads as line_loads,
    truss_joint_loads as truss_joint_loads,
)
from calcpack.loads.roof_profiles import (
    snow_profiles_asce7 as snow_profiles_asce7,
    snow_profiles_en as snow_profiles_en,
    wind_profiles_asce7 as wind_profiles_asce7,
    wind_profiles_asce7_directional as wind_profiles_asce7_directional,
    wind_profiles_en as wind_profiles_en,
)
from calcpack.loads.snow_asce7 import (
    SnowRoofASCE7 as SnowRoofASCE7,
    SnowSiteASCE7 as SnowSiteASCE7,
    roof_snow_asce7 as roof_snow_asce7,
)
from calcpack.loads.snow_asce7_drift import (
    SlidingSnowASCE7 as SlidingSnowASCE7,
    SnowDriftASCE7 as SnowDriftASCE7,
    drift_asce7 as drift_asce7,
    sliding_snow_asce7 as sliding_snow_asce7,
)
from calcpack.loads.snow_en1991 import (
    SnowDriftEN as SnowDriftEN,
    SnowRoofEN as SnowRoofEN,
    SnowSiteEN as SnowSiteEN,
    roof_snow_en as roof_snow_en,
    snow_drift_en as snow_drift_en,
)
from calcpack.loads.takedown import (
    Takedown as Takedown,
    reactions_by_case as reactions_by_case,
    takedown as takedown,
)
from calcpack.loads.wind_asce7 import (
    Topography as Topography,
    WindSiteASCE7 as WindSiteASCE7,
    velocity_pressure_asce7 as velocity_pressure_asce7,
)
from calcpack.loads.wall_cases import (
    wall_line_loads as wall_line_loads,
    wall_profiles_asce7_directional as wall_profiles_asce7_directional,
)
from calcpack.loads.wind_asce7_directional import (
    DirectionalBuildingASCE7 as DirectionalBuildingASCE7,
    DirectionalWindASCE7 as DirectionalWindASCE7,
    directional_wind_asce7 as directional_wind_asce7,
)
from calcpack.loads.wind_asce7_gust import (
    BuildingVibration as BuildingVibration,
    approximate_vibration_asce7 as approximate_vibration_asce7,
    gust_effect_factor_asce7 as gust_effect_factor_asce7,
)
from calcpack.loads.wind_asce7_cc import (
    cc_coefficient_asce7 as cc_coefficient_asce7,
    cc_roof_zones as cc_roof_zones,
)
from calcpack.loads.wind_asce7_cc_plan import (
    cc_roof_plan_asce7 as cc_roof_plan_asce7,
)
from calcpack.loads.wind_asce7_lowrise import (
    LowRiseBuildingASCE7 as LowRiseBuildingASCE7,
    components_wind_asce7 as components_wind_asce7,
    effective_wind_area as effective_wind_area,
    envelope_wind_asce7 as envelope_wind_asce7,
)
from calcpack.loads.wind_en1991 import (
    WindSiteEN as WindSiteEN,
    internal_pressure_en as internal_pressure_en,
    peak_pressure_en as peak_pressure_en,
)
from calcpack.loads.wind_en1991_cpe import (
    BuildingEN as BuildingEN,
    wind_pressures_en as wind_pressures_en,
)
from calcpack.package import (
    build as build,
    load_project as load_project,
    new_project as new_project,
    read_manifest as read_manifest,
)
from calcpack.package.reproduce import (
    verify_package as verify_package,
)
from calcpack.plots.footing import (
    FootingSketch as FootingSketch,
    footing_figure as footing_figure,
)
from calcpack.presets import (
    preset as preset,
    project_preset as project_preset,
)
from calcpack.sections import (
    Angle as Angle,
    BoundedRegion as BoundedRegion,
    Channel as Channel,
    Circle as Circle,
    HollowCircle as HollowCircle,
    ISection as ISection,
    Polygon as Polygon,
    Rectangle as Rectangle,
    RectangularHollow as RectangularHollow,
    Tee as Tee,
    Triangle as Triangle,
    composite as composite,
    sawn_timber as sawn_timber,
    second_moment_from_radius as second_moment_from_radius,
)
from calcpack.sections.aisc_database import (
    SteelGrade as SteelGrade,
    SteelShape as SteelShape,
    aisc_shape as aisc_shape,
    aisc_shape_names as aisc_shape_names,
    steel_grade as steel_grade,
)
from calcpack.sections.double_angle import (
    double_angle as double_angle,
)
from calcpack.sections.eurocode_tables import (
    EuroSection as EuroSection,
    euro_section as euro_section,
    euro_section_names as euro_section_names,
)
from calcpack.sections.rebar import (
    rebar as rebar,
)
from calcpack.sections.steel_bars import (
    rectangular_bar as rectangular_bar,
    round_bar as round_bar,
)
from calcpack.signing import (
    diff_packages as diff_packages,
    make_demo_credentials as make_demo_credentials,
    sign_package as sign_package,
)
from calcpack.sizing import (
    Candidate as Candidate,
    DeflectionLimit as DeflectionLimit,
    GradedSize as GradedSize,
    SearchSpace as SearchSpace,
    SizingResult as SizingResult,
    aisc_beam_space as aisc_beam_space,
    aisc_candidates as aisc_candidates,
    glulam_beam_space as glulam_beam_space,
    lightest_aisc_beam as lightest_aisc_beam,
    lightest_glulam_beam as lightest_glulam_beam,
    lightest_nds_beam as lightest_nds_beam,
    lightest_nds_post as lightest_nds_post,
    lightest_sections as lightest_sections,
    nds_beam_space as nds_beam_space,
    nds_graded_beam_space as nds_graded_beam_space,
    nds_post_space as nds_post_space,
    sawn_candidates as sawn_candidates,
)
from calcpack.units import (
    Q_ as Q_,
    get_display as get_display,
    set_display as set_display,
    ureg as ureg,
)
from calcpack.working import (
    Abs as Abs,
    Block as Block,
    Check as Check,
    Derived as Derived,
    Equation as Equation,
    Exports as Exports,
    Figure as Figure,
    Given as Given,
    Heading as Heading,
    Imported as Imported,
    Max as Max,
    Min as Min,
    NotCovered as NotCovered,
    Sheet as Sheet,
    Table as Table,
    Text as Text,
    Unknown as Unknown,
    Verdict as Verdict,
    atan as atan,
    cos as cos,
    sin as sin,
    sqrt as sqrt,
    tan as tan,
)
