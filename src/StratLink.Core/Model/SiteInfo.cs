namespace StratLink.Model;

/// <summary>Where the cores come from. Coordinates in decimal degrees, optional.</summary>
public sealed record SiteInfo(string Name = "", double? Latitude = null, double? Longitude = null);
