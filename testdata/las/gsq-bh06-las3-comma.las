~Version
VERS.   3.0 : CWLS LOG ASCII STANDARD - VERSION 3.0
WRAP.   NO : ONE LINE PER DEPTH STEP
DLM .   COMMA : DELIMITING CHARACTER BETWEEN DATA COLUMNS
~Well
STRT .M 30.0 : First index value {F}
STOP .M 31.5 : Last index value {F}
STEP .M 0.5 : Step {F}
NULL . -999.25 : Null value
WELL . GSQ-BH06 : Well name
COMP . Greyscar Quarry Ltd : Company
DATE . 15/03/2024 : Log date {DD/MM/YYYY}
TIME . 09:45 : Log time {hh:mm}
~Log_Parameter
BS .MM 96.0 : Bit size {F}
~Log_Definition
DEPT .M : Depth {F}
GR .GAPI : Gamma ray {F}
DEN .G/CC : Bulk density {F}
~Log_Data | Log_Definition
30.0,41.5,2.66
30.5,43.0,-999.25
31.0,44.8,2.71
31.5,40.2,2.69
~Inclinometry_Definition
MD .M : Measured depth {F}
AZIM .DEG : Azimuth {F}
INCL .DEG : Inclination from vertical {F}
~Inclinometry_Data | Inclinometry_Definition
0.0,12.0,30.0
30.0,12.5,30.4
