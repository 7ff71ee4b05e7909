using System.Globalization;
using System.Text;
using PlanDesk.Core.Targets;

namespace PlanDesk.Server.Targets;

/// <summary>
/// A plant-day's targets as CSV for control systems that read tables: comment lines (starting with '#') with the
/// caution and the version, then the sheet in the same columns <c>plandesk solve</c> writes: one row per period.
/// </summary>
internal static class TargetCsv
{
    public static string Write(TargetsResponse targets)
    {
        var sheet = targets.Sheet;
        var text = new StringBuilder();
        text.Append("# ").AppendLine(sheet.Caution);
        text.AppendLine(CultureInfo.InvariantCulture,
            $"# plant {sheet.Plant}, {sheet.Date:uuuu-MM-dd} ({sheet.TimeZone}), version {targets.Version}, treatment level {sheet.TreatmentLevel}: " +
            $"effluent total N {sheet.EffluentTotalNitrogenMgPerL} mg/L, total P {sheet.EffluentTotalPhosphorusMgPerL} mg/L");
        text.Append(TargetWriters.ToCsv(sheet));
        return text.ToString();
    }
}
