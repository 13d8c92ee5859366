Attribute VB_Name = "hydrograde"
' hydrograde for spreadsheets (64-bit Office, VBA 7): declarations of the scalar
' functions of hydrograde.dll and worksheet functions that return a value or an Excel
' error value (#NUM! for a number out of range, #VALUE! for a bad name or argument, #N/A
' when there is no solution). HgLastError() gives the message of the last failure.
'
' Put hydrograde.dll on the DLL search path (or next to the workbook and ChDir there) and
' import this module. Units are SI: m, s, kg, Pa, K, m^3/s, Pa*s, kg/m^3.
' Results are engineering estimates with stated uncertainty; designs must be checked by a
' competent engineer against the codes and standards that apply where they are built.
'
' Each Declare below is checked against hydrograde.h by tests/c/check_vba.py (names,
' argument counts and types); tests/c/test_ctypes.py calls the library with these types.
Option Explicit

' ---- declarations (C types: Double = double, Long = int32_t/uint32_t,
' ---- LongPtr = size_t or pointer, ByVal String = const char *, ByRef = pointer) ----
Public Declare PtrSafe Function hg_version Lib "hydrograde.dll" () As LongPtr
Public Declare PtrSafe Function hg_abi_version Lib "hydrograde.dll" () As Long
Public Declare PtrSafe Function hg_status_name Lib "hydrograde.dll" (ByVal status As Long) As LongPtr
Public Declare PtrSafe Function hg_last_error Lib "hydrograde.dll" (ByVal buf As String, ByVal length As LongPtr) As LongPtr
Public Declare PtrSafe Function hg_warning_name Lib "hydrograde.dll" (ByVal bit As Long) As LongPtr
Public Declare PtrSafe Function hg_correlation_from_name Lib "hydrograde.dll" (ByVal correlation_name As String, ByRef correlation As Long) As Long
Public Declare PtrSafe Function hg_correlation_name Lib "hydrograde.dll" (ByVal correlation As Long) As LongPtr
Public Declare PtrSafe Function hg_regime_name Lib "hydrograde.dll" (ByVal regime As Long) As LongPtr
Public Declare PtrSafe Function hg_darcy_factor Lib "hydrograde.dll" (ByVal re As Double, ByVal rel_roughness As Double, ByVal correlation As Long, ByRef f As Double) As Long
Public Declare PtrSafe Function hg_darcy_factor_full Lib "hydrograde.dll" (ByVal re As Double, ByVal rel_roughness As Double, ByVal correlation As Long, ByRef f As Double, ByRef df_dre As Double, ByRef df_drel_roughness As Double, ByRef regime As Long, ByRef warnings As Long) As Long
Public Declare PtrSafe Function hg_water Lib "hydrograde.dll" (ByVal temperature As Double, ByVal pressure As Double, ByRef density As Double, ByRef viscosity As Double) As Long
Public Declare PtrSafe Function hg_air Lib "hydrograde.dll" (ByVal temperature As Double, ByVal pressure As Double, ByRef density As Double, ByRef viscosity As Double) As Long
Public Declare PtrSafe Function hg_water_vapour_pressure Lib "hydrograde.dll" (ByVal temperature As Double, ByRef pressure As Double) As Long
Public Declare PtrSafe Function hg_convert Lib "hydrograde.dll" (ByVal value As Double, ByVal from_unit As String, ByVal to_unit As String, ByRef result As Double) As Long
Public Declare PtrSafe Function hg_convert_head Lib "hydrograde.dll" (ByVal value As Double, ByVal from_unit As String, ByVal to_unit As String, ByVal density As Double, ByRef result As Double) As Long
Public Declare PtrSafe Function hg_unit_name Lib "hydrograde.dll" (ByVal index As LongPtr, ByVal buf As String, ByVal length As LongPtr, ByRef needed As LongPtr) As Long
Public Declare PtrSafe Function hg_fitting_k Lib "hydrograde.dll" (ByVal fitting_name As String, ByVal re As Double, ByVal bore As Double, ByVal pipe_rel_roughness As Double, ByRef k As Double, ByRef dk_dre As Double) As Long
Public Declare PtrSafe Function hg_fitting_catalogue_name Lib "hydrograde.dll" (ByVal index As LongPtr, ByVal buf As String, ByVal length As LongPtr, ByRef needed As LongPtr) As Long
Public Declare PtrSafe Function hg_section_properties Lib "hydrograde.dll" (ByVal shape As Long, ByVal a As Double, ByVal b As Double, ByRef area As Double, ByRef wetted_perimeter As Double, ByRef hydraulic_diameter As Double, ByRef laminar_constant As Double) As Long
Public Declare PtrSafe Function hg_pipe_head_loss Lib "hydrograde.dll" (ByVal diameter As Double, ByVal length As Double, ByVal roughness As Double, ByVal density As Double, ByVal viscosity As Double, ByVal flow As Double, ByRef head_loss As Double, ByRef dhead_dflow As Double) As Long
Public Declare PtrSafe Function hg_reynolds Lib "hydrograde.dll" (ByVal flow As Double, ByVal diameter As Double, ByVal density As Double, ByVal viscosity As Double, ByRef re As Double) As Long
Public Declare PtrSafe Function hg_roughness Lib "hydrograde.dll" (ByVal material As String, ByRef typical As Double, ByRef low As Double, ByRef high As Double) As Long
Public Declare PtrSafe Function hg_roughness_material_name Lib "hydrograde.dll" (ByVal index As LongPtr, ByVal buf As String, ByVal length As LongPtr, ByRef needed As LongPtr) As Long
Public Declare PtrSafe Function hg_roughness_aged Lib "hydrograde.dll" (ByVal initial As Double, ByVal rate As Double, ByVal years As Double, ByRef roughness As Double) As Long
Public Declare PtrSafe Function hg_pipe_size Lib "hydrograde.dll" (ByVal table_name As String, ByVal nominal As String, ByVal schedule As String, ByRef outside_diameter As Double, ByRef wall As Double, ByRef inside_diameter As Double) As Long
Public Declare PtrSafe Function hg_pipe_size_at_least Lib "hydrograde.dll" (ByVal table_name As String, ByVal schedule As String, ByVal min_inside_diameter As Double, ByRef inside_diameter As Double, ByVal nominal As String, ByVal length As LongPtr, ByRef needed As LongPtr) As Long
Public Declare PtrSafe Function hg_correlation_validity Lib "hydrograde.dll" (ByVal correlation As Long, ByRef re_min As Double, ByRef re_max As Double, ByRef rel_roughness_min As Double, ByRef rel_roughness_max As Double, ByRef accuracy As Double) As Long
Public Declare PtrSafe Function hg_water_saturation_temperature Lib "hydrograde.dll" (ByVal pressure As Double, ByRef temperature As Double) As Long
Public Declare PtrSafe Function hg_transition_limits Lib "hydrograde.dll" (ByVal re As Double, ByVal rel_roughness As Double, ByVal correlation As Long, ByRef laminar As Double, ByRef turbulent As Double) As Long
Public Declare PtrSafe Function hg_turbulent_diameter Lib "hydrograde.dll" (ByVal shape As Long, ByVal a As Double, ByVal b As Double, ByVal mode As Long, ByRef diameter As Double) As Long
Public Declare PtrSafe Function hg_pipe_table_schedule Lib "hydrograde.dll" (ByVal table_name As String, ByVal index As LongPtr, ByVal buf As String, ByVal length As LongPtr, ByRef needed As LongPtr) As Long
Public Declare PtrSafe Function hg_pipe_table_nominal Lib "hydrograde.dll" (ByVal table_name As String, ByVal index As LongPtr, ByVal buf As String, ByVal length As LongPtr, ByRef needed As LongPtr) As Long

Private Declare PtrSafe Function lstrlenA Lib "kernel32" (ByVal p As LongPtr) As Long
Private Declare PtrSafe Sub RtlMoveMemory Lib "kernel32" (ByVal dest As String, ByVal src As LongPtr, ByVal n As LongPtr)

Private Const HG_OK As Long = 0
Private Const HG_ERR_NOT_FINITE As Long = 10
Private Const HG_ERR_OUT_OF_RANGE As Long = 11
Private Const HG_ERR_NO_SOLUTION As Long = 20

' A static C string returned by the library, as a VBA String.
Private Function CString(ByVal p As LongPtr) As String
    Dim n As Long, s As String
    If p = 0 Then Exit Function
    n = lstrlenA(p)
    s = String$(n, vbNullChar)
    RtlMoveMemory s, p, n
    CString = s
End Function

' The Excel error value of a status code.
Private Function ErrorOf(ByVal status As Long) As Variant
    Select Case status
        Case HG_ERR_NOT_FINITE, HG_ERR_OUT_OF_RANGE
            ErrorOf = CVErr(xlErrNum)
        Case HG_ERR_NO_SOLUTION
            ErrorOf = CVErr(xlErrNA)
        Case Else
            ErrorOf = CVErr(xlErrValue)
    End Select
End Function

' The message of the last failed call on this thread, e.g. "re = -1: must be greater than 0".
Public Function HgLastError() As String
    Dim n As LongPtr, buf As String
    n = hg_last_error(vbNullString, 0)
    buf = String$(CLng(n) + 1, vbNullChar)
    hg_last_error buf, n + 1
    HgLastError = Left$(buf, CLng(n))
End Function

' The library version, e.g. "0.1.0".
Public Function HgVersion() As String
    HgVersion = CString(hg_version())
End Function

' The HG_CORRELATION_* value of a correlation name; its status goes to status.
Private Function CorrelationOf(ByVal correlation_name As String, ByRef status As Long) As Long
    Dim c As Long
    status = hg_correlation_from_name(correlation_name, c)
    CorrelationOf = c
End Function

' Darcy friction factor at Reynolds number re and relative roughness rel_roughness;
' correlation: "colebrook" (default), "haaland", "swamee_jain", "churchill",
' "serghides", "blasius" or "fully_rough".
Public Function HgDarcyFactor(ByVal re As Double, ByVal rel_roughness As Double, _
                              Optional ByVal correlation As String = "colebrook") As Variant
    Dim s As Long, c As Long, f As Double
    c = CorrelationOf(correlation, s)
    If s = HG_OK Then s = hg_darcy_factor(re, rel_roughness, c, f)
    If s = HG_OK Then HgDarcyFactor = f Else HgDarcyFactor = ErrorOf(s)
End Function

' d f / d Re at the same point as HgDarcyFactor.
Public Function HgDarcyFactorDRe(ByVal re As Double, ByVal rel_roughness As Double, _
                                 Optional ByVal correlation As String = "colebrook") As Variant
    Dim s As Long, c As Long, f As Double, d1 As Double, d2 As Double, rg As Long, w As Long
    c = CorrelationOf(correlation, s)
    If s = HG_OK Then s = hg_darcy_factor_full(re, rel_roughness, c, f, d1, d2, rg, w)
    If s = HG_OK Then HgDarcyFactorDRe = d1 Else HgDarcyFactorDRe = ErrorOf(s)
End Function

' The flow regime at Reynolds number re: "laminar", "transitional" or "turbulent".
Public Function HgRegime(ByVal re As Double, ByVal rel_roughness As Double, _
                         Optional ByVal correlation As String = "colebrook") As Variant
    Dim s As Long, c As Long, f As Double, d1 As Double, d2 As Double, rg As Long, w As Long
    c = CorrelationOf(correlation, s)
    If s = HG_OK Then s = hg_darcy_factor_full(re, rel_roughness, c, f, d1, d2, rg, w)
    If s = HG_OK Then HgRegime = CString(hg_regime_name(rg)) Else HgRegime = ErrorOf(s)
End Function

' Density (kg/m^3) of liquid water at temperature (K) and absolute pressure (Pa).
Public Function HgWaterDensity(ByVal temperature As Double, Optional ByVal pressure As Double = 101325#) As Variant
    Dim s As Long, rho As Double, mu As Double
    s = hg_water(temperature, pressure, rho, mu)
    If s = HG_OK Then HgWaterDensity = rho Else HgWaterDensity = ErrorOf(s)
End Function

' Dynamic viscosity (Pa*s) of liquid water at temperature (K) and absolute pressure (Pa).
Public Function HgWaterViscosity(ByVal temperature As Double, Optional ByVal pressure As Double = 101325#) As Variant
    Dim s As Long, rho As Double, mu As Double
    s = hg_water(temperature, pressure, rho, mu)
    If s = HG_OK Then HgWaterViscosity = mu Else HgWaterViscosity = ErrorOf(s)
End Function

' Vapour pressure of water (Pa) at temperature (K).
Public Function HgWaterVapourPressure(ByVal temperature As Double) As Variant
    Dim s As Long, p As Double
    s = hg_water_vapour_pressure(temperature, p)
    If s = HG_OK Then HgWaterVapourPressure = p Else HgWaterVapourPressure = ErrorOf(s)
End Function

' Density (kg/m^3) of dry air at temperature (K) and absolute pressure (Pa).
Public Function HgAirDensity(ByVal temperature As Double, Optional ByVal pressure As Double = 101325#) As Variant
    Dim s As Long, rho As Double, mu As Double
    s = hg_air(temperature, pressure, rho, mu)
    If s = HG_OK Then HgAirDensity = rho Else HgAirDensity = ErrorOf(s)
End Function

' Dynamic viscosity (Pa*s) of dry air at temperature (K) and absolute pressure (Pa).
Public Function HgAirViscosity(ByVal temperature As Double, Optional ByVal pressure As Double = 101325#) As Variant
    Dim s As Long, rho As Double, mu As Double
    s = hg_air(temperature, pressure, rho, mu)
    If s = HG_OK Then HgAirViscosity = mu Else HgAirViscosity = ErrorOf(s)
End Function

' value converted from unit from_unit to unit to_unit, e.g. =HgConvert(2, "in", "mm").
Public Function HgConvert(ByVal value As Double, ByVal from_unit As String, ByVal to_unit As String) As Variant
    Dim s As Long, r As Double
    s = hg_convert(value, from_unit, to_unit, r)
    If s = HG_OK Then HgConvert = r Else HgConvert = ErrorOf(s)
End Function

' A pressure and a head of a liquid of density (kg/m^3) converted into each other,
' e.g. =HgConvertHead(10, "m_head", "kPa", 998.2).
Public Function HgConvertHead(ByVal value As Double, ByVal from_unit As String, ByVal to_unit As String, _
                              ByVal density As Double) As Variant
    Dim s As Long, r As Double
    s = hg_convert_head(value, from_unit, to_unit, density, r)
    If s = HG_OK Then HgConvertHead = r Else HgConvertHead = ErrorOf(s)
End Function

' K of the catalogue fitting fitting_name at Reynolds number re in bore (m), beside a pipe of
' relative roughness pipe_rel_roughness.
Public Function HgFittingK(ByVal fitting_name As String, ByVal re As Double, ByVal bore As Double, _
                           Optional ByVal pipe_rel_roughness As Double = 0#) As Variant
    Dim s As Long, k As Double, dk As Double
    s = hg_fitting_k(fitting_name, re, bore, pipe_rel_roughness, k, dk)
    If s = HG_OK Then HgFittingK = k Else HgFittingK = ErrorOf(s)
End Function

' The HG_SECTION_* value of a shape name, or -1.
Private Function ShapeOf(ByVal shape As String) As Long
    Select Case LCase$(shape)
        Case "circle": ShapeOf = 0
        Case "annulus": ShapeOf = 1
        Case "rectangle": ShapeOf = 2
        Case "ellipse": ShapeOf = 3
        Case "triangle": ShapeOf = 4
        Case Else: ShapeOf = -1
    End Select
End Function

' One property of a section: what = "area" (m^2), "wetted_perimeter" (m),
' "hydraulic_diameter" (m) or "laminar_constant"; shape = "circle" (a = diameter),
' "annulus" (a = outer, b = inner), "rectangle" (a = width, b = height), "ellipse"
' (a = major, b = minor) or "triangle" (a = side).
Public Function HgSection(ByVal what As String, ByVal shape As String, ByVal a As Double, _
                          Optional ByVal b As Double = 0#) As Variant
    Dim s As Long, ar As Double, pe As Double, dh As Double, c As Double
    s = hg_section_properties(ShapeOf(shape), a, b, ar, pe, dh, c)
    If s <> HG_OK Then HgSection = ErrorOf(s): Exit Function
    Select Case LCase$(what)
        Case "area": HgSection = ar
        Case "wetted_perimeter": HgSection = pe
        Case "hydraulic_diameter": HgSection = dh
        Case "laminar_constant": HgSection = c
        Case Else: HgSection = CVErr(xlErrValue)
    End Select
End Function

' Head loss (m of fluid) of a round pipe at flow (m^3/s, signed): diameter, length and
' roughness in m, density in kg/m^3, viscosity in Pa*s.
Public Function HgPipeHeadLoss(ByVal diameter As Double, ByVal length As Double, ByVal roughness As Double, _
                               ByVal density As Double, ByVal viscosity As Double, ByVal flow As Double) As Variant
    Dim s As Long, h As Double, dh As Double
    s = hg_pipe_head_loss(diameter, length, roughness, density, viscosity, flow, h, dh)
    If s = HG_OK Then HgPipeHeadLoss = h Else HgPipeHeadLoss = ErrorOf(s)
End Function

' d(head loss)/d(flow) (s/m^2) of a round pipe, with the arguments of HgPipeHeadLoss.
Public Function HgPipeHeadLossDFlow(ByVal diameter As Double, ByVal length As Double, ByVal roughness As Double, _
                                    ByVal density As Double, ByVal viscosity As Double, ByVal flow As Double) As Variant
    Dim s As Long, h As Double, dh As Double
    s = hg_pipe_head_loss(diameter, length, roughness, density, viscosity, flow, h, dh)
    If s = HG_OK Then HgPipeHeadLossDFlow = dh Else HgPipeHeadLossDFlow = ErrorOf(s)
End Function

' Reynolds number of flow (m^3/s) in a round pipe of diameter (m).
Public Function HgReynolds(ByVal flow As Double, ByVal diameter As Double, ByVal density As Double, _
                           ByVal viscosity As Double) As Variant
    Dim s As Long, re As Double
    s = hg_reynolds(flow, diameter, density, viscosity, re)
    If s = HG_OK Then HgReynolds = re Else HgReynolds = ErrorOf(s)
End Function

' Typical absolute roughness (m) of new pipe of a catalogue material, e.g. "commercial_steel".
Public Function HgRoughness(ByVal material As String) As Variant
    Dim s As Long, t As Double, lo As Double, hi As Double
    s = hg_roughness(material, t, lo, hi)
    If s = HG_OK Then HgRoughness = t Else HgRoughness = ErrorOf(s)
End Function

' Roughness (m) after years of service, growing from initial (m) at rate (m per year).
Public Function HgRoughnessAged(ByVal initial As Double, ByVal rate As Double, ByVal years As Double) As Variant
    Dim s As Long, r As Double
    s = hg_roughness_aged(initial, rate, years, r)
    If s = HG_OK Then HgRoughnessAged = r Else HgRoughnessAged = ErrorOf(s)
End Function

' Inside diameter (m) of a standard pipe: table_name "steel", "stainless", "copper" or
' "pvc"; nominal size and schedule as printed, e.g. =HgPipeInsideDiameter("steel", "2", "40").
Public Function HgPipeInsideDiameter(ByVal table_name As String, ByVal nominal As String, _
                                     ByVal schedule As String) As Variant
    Dim s As Long, od As Double, w As Double, id As Double
    s = hg_pipe_size(table_name, nominal, schedule, od, w, id)
    If s = HG_OK Then HgPipeInsideDiameter = id Else HgPipeInsideDiameter = ErrorOf(s)
End Function

' Nominal size of the smallest standard pipe whose inside diameter is at least
' min_inside_diameter (m), e.g. =HgPipeSizeAtLeast("pvc", "40", 0.05).
Public Function HgPipeSizeAtLeast(ByVal table_name As String, ByVal schedule As String, _
                                  ByVal min_inside_diameter As Double) As Variant
    Dim s As Long, id As Double, need As LongPtr, buf As String
    buf = String$(32, vbNullChar)
    s = hg_pipe_size_at_least(table_name, schedule, min_inside_diameter, id, buf, 32, need)
    If s = HG_OK Then HgPipeSizeAtLeast = Left$(buf, CLng(need)) Else HgPipeSizeAtLeast = ErrorOf(s)
End Function

' Saturation (boiling) temperature of water (K) at absolute pressure (Pa).
Public Function HgWaterSaturationTemperature(ByVal pressure As Double) As Variant
    Dim s As Long, t As Double
    s = hg_water_saturation_temperature(pressure, t)
    If s = HG_OK Then HgWaterSaturationTemperature = t Else HgWaterSaturationTemperature = ErrorOf(s)
End Function

' Published accuracy of a correlation against Colebrook, as a fraction (0.015 = 1.5 %).
Public Function HgCorrelationAccuracy(Optional ByVal correlation As String = "colebrook") As Variant
    Dim s As Long, c As Long, a As Double, b As Double, lo As Double, hi As Double, acc As Double
    c = CorrelationOf(correlation, s)
    If s = HG_OK Then s = hg_correlation_validity(c, a, b, lo, hi, acc)
    If s = HG_OK Then HgCorrelationAccuracy = acc Else HgCorrelationAccuracy = ErrorOf(s)
End Function
