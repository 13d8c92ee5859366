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
Public Declare PtrSafe Function hg_correlation_from_name Lib "hydrograde.dll" (ByVal name As String, ByRef correlation As Long) As Long
Public Declare PtrSafe Function hg_correlation_name Lib "hydrograde.dll" (ByVal correlation As Long) As LongPtr
Public Declare PtrSafe Function hg_regime_name Lib "hydrograde.dll" (ByVal regime As Long) As LongPtr
Public Declare PtrSafe Function hg_darcy_factor Lib "hydrograde.dll" (ByVal re As Double, ByVal rel_roughness As Double, ByVal correlation As Long, ByRef f As Double) As Long
Public Declare PtrSafe Function hg_darcy_factor_full Lib "hydrograde.dll" (ByVal re As Double, ByVal rel_roughness As Double, ByVal correlation As Long, ByRef f As Double, ByRef df_dre As Double, ByRef df_drel_roughness As Double, ByRef regime As Long, ByRef warnings As Long) As Long
'@@MORE_DECLARES@@

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

' The HG_CORRELATION_* value of a correlation name, or -1 with the message set.
Private Function CorrelationOf(ByVal name As String, ByRef status As Long) As Long
    Dim c As Long
    status = hg_correlation_from_name(name, c)
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
'@@MORE_WORKSHEET@@
