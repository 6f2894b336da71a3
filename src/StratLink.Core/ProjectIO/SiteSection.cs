using StratLink.Model;
using YamlDotNet.RepresentationModel;

namespace StratLink.ProjectIO;

internal static class SiteSection
{
    public static SiteInfo Read(YamlMap? m)
    {
        if (m is null) return new SiteInfo();
        var site = new SiteInfo(m.String("name") ?? "", m.Double("latitude"), m.Double("longitude"));
        if (site.Latitude is < -90 or > 90) m.Error("latitude", $"latitude {site.Latitude} is outside -90..90");
        if (site.Longitude is < -180 or > 360) m.Error("longitude", $"longitude {site.Longitude} is outside -180..360");
        m.Finish();
        return site;
    }

    public static YamlMappingNode Write(SiteInfo site)
    {
        var n = new YamlMappingNode { { "name", YamlOut.Str(site.Name) } };
        if (site.Latitude is double lat) n.Add("latitude", YamlOut.Num(lat));
        if (site.Longitude is double lon) n.Add("longitude", YamlOut.Num(lon));
        return n;
    }
}
