// Package widgets holds Propflight's Fyne widgets: the wireframe preview of a
// take (Preview), the frame strip with its marks (Timeline), the slider
// with a typed entry and unit (NumberField), and reference footage with
// the user's marks on it (FootageView, fed through the small FrameSource
// interface so that this package never imports app). The pictures come
// from the pure renderer in widgets/wire; this package only adds the
// toolkit around it.
//
// Frames and units:
//   - Values are SI inside (m, kg, kg/m^3, s, m/s, m/s^2) except where a
//     Quantity says otherwise: angles are degrees and spin rates turns per
//     second, because those are what the screen and the project file show.
//     Imperial display (in or ft, lb, lb/ft^3, ft/s, ft/s^2) is an edge
//     conversion only; see units.go for the exact factors (NIST SP 811,
//     Appendix B).
//   - Frames count from 0 at release; frame n is at n / fps seconds and its
//     label is physics.Rate.Timecode(n).
//   - World: right-handed, +Y up, metres, the same as package wire.
//   - Widget coordinates are Fyne's device-independent units; the preview
//     renders at the canvas's pixel size (scale times the widget size), so
//     it stays sharp on HiDPI screens.
//
// Concurrency: like every Fyne widget these must be touched from the UI
// goroutine only. Simulate off it and hand the immutable take to the UI
// with fyne.Do, then call Preview.SetScene and Timeline.SetRange there.
package widgets
